/** Says which setting a view waits for. */
export function MissingSetting({ children }: { children: string }) {
  return (
    <p className="rounded-md border border-dashed border-ink-300 px-4 py-4 text-sm text-ink-700">
      {children}
    </p>
  );
}
