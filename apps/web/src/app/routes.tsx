import type { RouteObject } from 'react-router-dom';
import { AppShell } from '@/app/layout/app-shell.tsx';
import { HomePage } from '@/app/routes/home-page.tsx';
import { NotFoundPage } from '@/app/routes/not-found-page.tsx';
import { RouteErrorPage } from '@/app/routes/route-error-page.tsx';
import { SignInPage } from '@/features/auth/components/sign-in-page.tsx';

/** The route table; the browser router and the tests' memory routers are built from it. */
export const routes: RouteObject[] = [
  {
    element: <AppShell />,
    errorElement: <RouteErrorPage />,
    children: [
      { index: true, element: <HomePage /> },
      { path: 'sign-in', element: <SignInPage /> },
      { path: '*', element: <NotFoundPage /> },
    ],
  },
];
