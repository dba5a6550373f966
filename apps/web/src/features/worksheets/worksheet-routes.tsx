import type { RouteObject } from 'react-router-dom';

/**
 * The worksheet routes, to be mounted under `/o/:orgSlug/`. The page (editor, engine, results)
 * loads as its own chunk when first visited; the plots load later still, with their view.
 */
export const worksheetRoutes: RouteObject[] = [
  {
    path: 'worksheets/scratch',
    lazy: async () => {
      const { ScratchWorksheetPage } =
        await import('@/features/worksheets/components/scratch-worksheet-page.tsx');
      return { Component: ScratchWorksheetPage };
    },
  },
];
