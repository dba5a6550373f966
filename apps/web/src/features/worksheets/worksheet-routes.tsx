import type { RouteObject } from 'react-router-dom';
import { PageLoading } from '@/components/ui/page-loading.tsx';
import type { WorksheetSlotsComponent } from '@/features/worksheets/components/page/worksheet-slots.ts';

export interface WorksheetRouteOptions {
  /** Loads what the app plugs into the saved-worksheet page; fetched with the page's chunk. */
  loadSlots?: () => Promise<WorksheetSlotsComponent>;
}

/**
 * The worksheet routes, to be mounted under `/o/:orgSlug/`. Each page loads as its own chunk
 * when first visited (the editor and engine with the worksheet pages); the plots load later
 * still, with their view.
 */
export const worksheetRoutes = ({ loadSlots }: WorksheetRouteOptions = {}): RouteObject[] => [
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
      const [{ WorksheetPage }, slots] = await Promise.all([
        import('@/features/worksheets/components/page/worksheet-page.tsx'),
        loadSlots?.(),
      ]);
      return { Component: () => <WorksheetPage slots={slots} /> };
    },
  },
];
