import { Outlet } from 'react-router-dom';
import { AppFooter } from '@/app/layout/app-footer.tsx';
import { AppHeader } from '@/app/layout/app-header.tsx';
import { FocusOnNavigation } from '@/app/layout/focus-on-navigation.tsx';
import { SessionWatcher } from '@/app/layout/session-watcher.tsx';

/**
 * Frame of every page: header (product, organization, health, account), the page, the caution
 * footer; it also ends the session in this browser when the server answers 401.
 */
export function AppShell() {
  return (
    <div className="flex min-h-screen flex-col">
      <SessionWatcher />
      <FocusOnNavigation />
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
