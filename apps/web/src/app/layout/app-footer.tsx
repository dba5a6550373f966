import { appConfig } from '@/config/app-config.ts';

export function AppFooter() {
  return (
    <footer className="border-t border-rule bg-surface">
      <div className="mx-auto max-w-6xl px-6 py-4 text-sm text-ink-600">
        <p>
          <strong className="font-semibold text-ink-700">Caution:</strong> {appConfig.productName}{' '}
          results are engineering aids, not a substitute for qualified review. Designs with
          hazardous voltages follow local codes and licensed engineering practice.
        </p>
      </div>
    </footer>
  );
}
