import type { RouteObject } from 'react-router-dom';
import { PageLoading } from '@/components/ui/page-loading.tsx';

/** The projects page, mounted under `/o/:orgSlug/`, loaded as its own chunk. */
export const projectRoutes: RouteObject[] = [
  {
    path: 'projects',
    HydrateFallback: PageLoading,
    lazy: async () => {
      const { ProjectsPage } = await import('@/features/projects/components/projects-page.tsx');
      return { Component: ProjectsPage };
    },
  },
];
