import { Link, useRouteError } from 'react-router-dom';

/** Shown when a route throws while rendering; keeps the visitor inside the app. */
export function RouteErrorPage() {
  const error = useRouteError();
  const detail = error instanceof Error ? error.message : 'An unexpected error occurred.';
  return (
    <main className="mx-auto flex min-h-screen max-w-xl flex-col justify-center gap-3 p-6">
      <title>Something went wrong · Biasproof</title>
      <h1 className="text-2xl font-bold text-ink-900">Something went wrong</h1>
      <p className="text-ink-700">{detail}</p>
      <Link to="/" className="font-semibold text-accent underline underline-offset-4">
        Back to the start page
      </Link>
    </main>
  );
}
