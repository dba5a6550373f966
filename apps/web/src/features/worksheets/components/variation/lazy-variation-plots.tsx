import { lazy, Suspense, type ComponentProps } from 'react';

/** The variation charts load with the charting library only when a view draws one. */
const Histogram = lazy(() =>
  import('@/features/worksheets/components/variation/histogram-plot.tsx').then((m) => ({
    default: m.HistogramPlot,
  })),
);
const Sensitivity = lazy(() =>
  import('@/features/worksheets/components/variation/sensitivity-plot.tsx').then((m) => ({
    default: m.SensitivityPlot,
  })),
);

function Drawing() {
  return <p className="py-8 text-center text-sm text-ink-600">Drawing the chart…</p>;
}

export function LazyHistogramPlot(props: ComponentProps<typeof Histogram>) {
  return (
    <Suspense fallback={<Drawing />}>
      <Histogram {...props} />
    </Suspense>
  );
}

export function LazySensitivityPlot(props: ComponentProps<typeof Sensitivity>) {
  return (
    <Suspense fallback={<Drawing />}>
      <Sensitivity {...props} />
    </Suspense>
  );
}
