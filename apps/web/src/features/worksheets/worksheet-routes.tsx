import type { RouteObject } from 'react-router-dom';
import { PageLoading } from '@/components/ui/page-loading.tsx';

/**
 * The worksheet routes, to be mounted under `/o/:orgSlug/`. Each page loads as its own chunk
 * when first visited (the editor and engine with the worksheet pages); the plots load later
 * still, with their view.
 */
export const worksheetRoutes: RouteObject[] = [
  {
    path: 'worksheets',
    HydrateFallback: PageLoading,
    lazy: async () => {
      const { WorksheetsPage } =
        await import('@/features/worksheets/components/list/worksheets-page.tsx');
      return { Component: WorksheetsPage };
    },
  },
  {
    path: 'projects/:projectId',
    HydrateFallback: PageLoading,
    lazy: async () => {
      const { WorksheetsPage } =
        await import('@/features/worksheets/components/list/worksheets-page.tsx');
      return { Component: WorksheetsPage };
    },
  },
  {
    path: 'worksheets/scratch',
    HydrateFallback: PageLoading,
    lazy: async () => {
      const { ScratchWorksheetPage } =
        await import('@/features/worksheets/components/scratch-worksheet-page.tsx');
      return { Component: ScratchWorksheetPage };
    },
  },
  {
    path: 'worksheets/:worksheetId',
    HydrateFallback: PageLoading,
    lazy: async () => {
      const { WorksheetPage } =
        await import('@/features/worksheets/components/page/worksheet-page.tsx');
      return { Component: WorksheetPage };
    },
  },
];
