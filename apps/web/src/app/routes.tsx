import type { RouteObject } from 'react-router-dom';
import { PageLoading } from '@/components/ui/page-loading.tsx';
import { AppShell } from '@/app/layout/app-shell.tsx';
import { HomePage } from '@/app/routes/home-page.tsx';
import { NotFoundPage } from '@/app/routes/not-found-page.tsx';
import { OrgLayout } from '@/app/routes/org-layout.tsx';
import { RequireSignIn } from '@/app/routes/require-sign-in.tsx';
import { RouteErrorPage } from '@/app/routes/route-error-page.tsx';
import { ForgotPasswordPage } from '@/features/auth/components/forgot-password-page.tsx';
import { ResetPasswordPage } from '@/features/auth/components/reset-password-page.tsx';
import { SignInPage } from '@/features/auth/components/sign-in-page.tsx';
import { AcceptInvitationPage } from '@/features/invitations/components/accept-invitation-page.tsx';
import { MembersPage } from '@/features/members/components/members-page.tsx';
import { ProfilePage } from '@/features/profile/components/profile-page.tsx';
import { projectRoutes } from '@/features/projects/project-routes.tsx';
import { MyQueuePage } from '@/features/queue/components/my-queue-page.tsx';
import { worksheetRoutes } from '@/features/worksheets/worksheet-routes.tsx';

/** The route table; the browser router and the tests' memory routers are built from it. */
export const routes: RouteObject[] = [
  {
    element: <AppShell />,
    errorElement: <RouteErrorPage />,
    children: [
      { index: true, element: <HomePage /> },
      { path: 'sign-in', element: <SignInPage /> },
      { path: 'forgot-password', element: <ForgotPasswordPage /> },
      { path: 'reset-password', element: <ResetPasswordPage /> },
      { path: 'invitations/:token', element: <AcceptInvitationPage /> },
      {
        element: <RequireSignIn />,
        children: [
          { path: 'profile', element: <ProfilePage /> },
          {
            path: 'o/:orgSlug',
            element: <OrgLayout />,
            children: [
              { index: true, element: <MyQueuePage /> },
              { path: 'members', element: <MembersPage /> },
              ...projectRoutes,
              ...worksheetRoutes({
                // The review rides along with the worksheet page's chunk.
                loadSlots: async () =>
                  (await import('@/app/routes/worksheet-review.tsx')).WorksheetReview,
              }),
              {
                path: 'worksheets/:worksheetId/history',
                HydrateFallback: PageLoading,
                lazy: async () => ({
                  Component: (await import('@/app/routes/worksheet-history-page.tsx'))
                    .WorksheetHistoryPage,
                }),
              },
              {
                path: 'audit',
                HydrateFallback: PageLoading,
                lazy: async () => ({
                  Component: (await import('@/app/routes/audit-route.tsx')).AuditRoute,
                }),
              },
            ],
          },
        ],
      },
      { path: '*', element: <NotFoundPage /> },
    ],
  },
];
