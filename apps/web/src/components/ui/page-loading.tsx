/** Shown while a page's code loads (the first visit to a lazily loaded page). */
export function PageLoading() {
  return (
    <p role="status" className="mx-auto w-full max-w-6xl text-sm text-ink-600">
      Loading…
    </p>
  );
}
