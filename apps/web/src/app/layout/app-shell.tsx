import { Outlet } from 'react-router-dom';
import { AppFooter } from '@/app/layout/app-footer.tsx';
import { AppHeader } from '@/app/layout/app-header.tsx';

/** Frame of every page: header with product name and health, the page, the caution footer. */
export function AppShell() {
  return (
    <div className="flex min-h-screen flex-col">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:absolute focus:left-4 focus:top-4 focus:z-10 focus:rounded-md focus:bg-surface focus:px-3 focus:py-2 focus:text-accent"
      >
        Skip to content
      </a>
      <AppHeader />
      <main id="main" tabIndex={-1} className="flex-1 px-6 py-10 focus:outline-none">
        <Outlet />
      </main>
      <AppFooter />
    </div>
  );
}
