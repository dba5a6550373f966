import { Link } from 'react-router-dom';
import { Card } from '@/components/ui/card.tsx';

export function NotFoundPage() {
  return (
    <div className="mx-auto w-full max-w-xl">
      <title>Page not found · Biasproof</title>
      <Card aria-labelledby="not-found-heading" className="flex flex-col items-start gap-3">
        <h1 id="not-found-heading" className="text-2xl font-bold text-ink-900">
          No page at this address
        </h1>
        <p className="text-ink-700">The link may be mistyped, or the page may have moved.</p>
        <Link
          to="/"
          className="font-semibold text-accent underline underline-offset-4 hover:text-accent-strong"
        >
          Back to the start page
        </Link>
      </Card>
    </div>
  );
}
