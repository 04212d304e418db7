import { createBrowserRouter, RouterProvider, type RouteObject } from 'react-router-dom';
import { AppLayout } from '@/components/layouts/app-layout';
import { PlainLayout } from '@/components/layouts/plain-layout';
import { RequireAuth } from '@/components/layouts/require-auth';
import { RouteErrorFallback } from '@/components/errors/error-fallback';
import { Loading } from '@/components/ui/page';

type Loader = () => Promise<{ default: React.ComponentType }>;
/** One module per screen, loaded when first visited. */
const screen = (load: Loader): Pick<RouteObject, 'lazy'> => ({ lazy: async () => ({ Component: (await load()).default }) });

// Each area adds its screens to the matching list below (one line each).
const publicScreens: RouteObject[] = [
  { path: '/sign-in', ...screen(() => import('./routes/sign-in')) },
  // accounts (issue 3): sign-up, forgot/reset password, verify e-mail, dev outbox
  { path: '/sign-up', ...screen(() => import('./routes/sign-up')) },
  { path: '/forgot-password', ...screen(() => import('./routes/forgot-password')) },
  { path: '/reset-password', ...screen(() => import('./routes/reset-password')) },
  { path: '/verify-email', ...screen(() => import('./routes/verify-email')) },
  { path: '/change-email', ...screen(() => import('./routes/change-email')) },
  { path: '/dev/outbox', ...screen(() => import('./routes/dev-outbox')) },
];

const standaloneScreens: RouteObject[] = [
  // full-screen pages outside the app shell, e.g. the Tally (issue 6) and the showcase /p/:token (issue 8)
  // The Tally is for the signed-in member only, but full-screen: guarded here, outside AppLayout.
  { element: <RequireAuth />, children: [{ path: '/projects/:projectId/pieces/:pieceId/count', ...screen(() => import('./routes/tally')) }] },
  { path: '/p/:token', ...screen(() => import('./routes/showcase')) },
  { path: '/m/:makerId', ...screen(() => import('./routes/maker-profile')) },
];

const memberScreens: RouteObject[] = [
  { index: true, ...screen(() => import('./routes/on-the-hook')) },
  // accounts (issue 3): /account
  { path: '/account', ...screen(() => import('./routes/account')) },
  // patterns (issue 5): /patterns, /patterns/new, /patterns/:patternId
  { path: '/patterns', ...screen(() => import('./routes/patterns')) },
  { path: '/patterns/new', ...screen(() => import('./routes/pattern-new')) },
  { path: '/patterns/:patternId', ...screen(() => import('./routes/pattern-edit')) },
  // projects (issue 5): /projects, /projects/new, /projects/:projectId, /yarns
  { path: '/projects', ...screen(() => import('./routes/projects')) },
  { path: '/projects/new', ...screen(() => import('./routes/project-new')) },
  { path: '/projects/:projectId', ...screen(() => import('./routes/project')) },
  { path: '/yarns', ...screen(() => import('./routes/yarn-shelf')) },
  // hook roll: /hooks
  { path: '/hooks', ...screen(() => import('./routes/hook-roll')) },
];

const adminScreens: RouteObject[] = [
  // accounts (issue 3): /admin
  { path: '/admin', ...screen(() => import('./routes/admin')) },
  { path: '/admin/reports', ...screen(() => import('./routes/admin-reports')) },
];

export const routes: RouteObject[] = [
  {
    errorElement: <RouteErrorFallback />,
    hydrateFallbackElement: <Loading />,
    children: [
      { element: <PlainLayout />, children: publicScreens },
      ...standaloneScreens,
      {
        element: <RequireAuth />,
        children: [
          { element: <AppLayout />, children: memberScreens },
          { element: <RequireAuth role="admin" />, children: [{ element: <AppLayout />, children: adminScreens }] },
        ],
      },
      { path: '*', element: <PlainLayout />, children: [{ path: '*', ...screen(() => import('./routes/not-found')) }] },
    ],
  },
];

const router = createBrowserRouter(routes);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
