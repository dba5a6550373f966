import { lazy, Suspense, type ComponentProps } from 'react';

/** The plots and their charting library load only when a view that draws one opens. */
const Bode = lazy(() =>
  import('@/features/worksheets/components/plots/bode-plot.tsx').then((m) => ({
    default: m.BodePlot,
  })),
);
const LoadLine = lazy(() =>
  import('@/features/worksheets/components/plots/load-line-plot.tsx').then((m) => ({
    default: m.LoadLinePlot,
  })),
);

function Drawing() {
  return <p className="py-8 text-center text-sm text-ink-600">Drawing the plot…</p>;
}

export function LazyBodePlot(props: ComponentProps<typeof Bode>) {
  return (
    <Suspense fallback={<Drawing />}>
      <Bode {...props} />
    </Suspense>
  );
}

export function LazyLoadLinePlot(props: ComponentProps<typeof LoadLine>) {
  return (
    <Suspense fallback={<Drawing />}>
      <LoadLine {...props} />
    </Suspense>
  );
}
