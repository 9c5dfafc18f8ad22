import { createBrowserRouter, Navigate } from 'react-router';
import { RouterProvider } from 'react-router/dom';
import { paths } from '@/config/paths';
import { rolesFor } from '@/config/office-nav';
import { PageLoading, RootError } from './routes/root-fallbacks';

/** Roles a route accepts, read by the office shell from the matched route's handle. */
export interface OfficeHandle {
  roles?: readonly string[];
}

const office = (path: string, load: () => Promise<object>) => ({
  path,
  lazy: load,
  handle: { roles: rolesFor(path) } satisfies OfficeHandle,
});

export const router = createBrowserRouter([
  {
    HydrateFallback: PageLoading,
    ErrorBoundary: RootError,
    children: [
      { path: paths.wall, lazy: () => import('./routes/wall') },
      {
        lazy: () => import('./routes/office/office-root'),
        children: [
          { path: paths.signIn, lazy: () => import('./routes/office/sign-in') },
          { path: paths.approve, lazy: () => import('./routes/approve') },
          {
            lazy: () => import('./routes/office/shell'),
            children: [
              { index: true, element: <Navigate to={paths.floor} replace /> },
              office(paths.floor, () => import('./routes/office/floor')),
              office(paths.dispatch, () => import('./routes/office/dispatch')),
              office(paths.repairOrders, () => import('./routes/office/repair-orders')),
              office(paths.repairOrderNew, () => import('./routes/office/repair-order-new')),
              office(paths.repairOrderImport, () => import('./routes/office/repair-order-import')),
              office(paths.repairOrderDetail, () => import('./routes/office/repair-order-detail')),
              office(paths.timecards, () => import('./routes/office/timecards')),
              office(paths.exceptions, () => import('./routes/office/exceptions')),
              office(paths.offlinePunches, () => import('./routes/office/offline-punches')),
              office(paths.reports, () => import('./routes/office/reports')),
              office(paths.findings, () => import('./routes/office/findings')),
              office(paths.admin.users, () => import('./routes/office/admin-users')),
              office(paths.admin.bays, () => import('./routes/office/admin-bays')),
              office(paths.admin.operations, () => import('./routes/office/admin-operations')),
              office(paths.admin.screens, () => import('./routes/office/admin-screens')),
              office(paths.admin.kiosks, () => import('./routes/office/admin-kiosks')),
              office(paths.admin.shop, () => import('./routes/office/admin-shop')),
              office(paths.admin.mailbox, () => import('./routes/office/admin-mailbox')),
              office(paths.admin.integrationKeys, () => import('./routes/office/admin-integration-keys')),
              office(paths.admin.webhooks, () => import('./routes/office/admin-webhooks')),
              { path: '*', lazy: () => import('./routes/office/not-found') },
            ],
          },
        ],
      },
    ],
  },
]);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
