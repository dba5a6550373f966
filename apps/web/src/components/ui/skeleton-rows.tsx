/**
 * Grey placeholder rows while a table loads, so the page does not jump when it arrives.
 * Hidden from screen readers, which hear `label` instead.
 */
export function SkeletonRows({
  label,
  rows = 5,
  columns,
}: {
  label: string;
  rows?: number;
  columns: number;
}) {
  return (
    <div role="status" aria-label={label} className="flex flex-col gap-3 py-2">
      {Array.from({ length: rows }, (_, r) => (
        <div key={r} aria-hidden="true" className="flex gap-4">
          {Array.from({ length: columns }, (_, c) => (
            <div
              key={c}
              className={`h-4 animate-pulse rounded bg-rule ${c === 0 ? 'flex-[3]' : 'flex-1'}`}
            />
          ))}
        </div>
      ))}
    </div>
  );
}
