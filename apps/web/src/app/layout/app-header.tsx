import { Link } from 'react-router-dom';
import { appConfig } from '@/config/app-config.ts';
import { HealthStatus } from '@/features/health/components/health-status.tsx';

export function AppHeader() {
  return (
    <header className="bg-ink-900 text-paper">
      <div className="mx-auto flex max-w-6xl flex-wrap items-center justify-between gap-4 px-6 py-3">
        <Link
          to="/"
          className="text-xl font-bold tracking-tight text-paper focus-visible:outline-2 focus-visible:outline-offset-4 focus-visible:outline-paper"
        >
          {appConfig.productName}
        </Link>
        <nav aria-label="Account" className="flex items-center gap-4">
          <HealthStatus />
          <Link
            to="/sign-in"
            className="text-sm font-semibold text-paper underline-offset-4 hover:underline"
          >
            Sign in
          </Link>
        </nav>
      </div>
    </header>
  );
}
