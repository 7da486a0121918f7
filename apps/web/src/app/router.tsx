import { createBrowserRouter, Outlet } from 'react-router';
import { RouteError } from '@/components/error-boundary';
import { AnonymousOnly, RequireAuth } from './guards';
import { Shell } from './shell';

/** One route module per URL, loaded lazily so the first page does not carry every feature. */
export const router = createBrowserRouter([
  {
    errorElement: <RouteError />,
    children: [
      {
        element: (
          <AnonymousOnly>
            <Outlet />
          </AnonymousOnly>
        ),
        children: [
          { path: '/sign-in', lazy: () => import('./routes/sign-in') },
          { path: '/forgot-password', lazy: () => import('./routes/forgot-password') },
        ],
      },
      // Reachable signed in or out: the link in an e-mail decides.
      { path: '/accept-invitation', lazy: () => import('./routes/accept-invitation') },
      { path: '/reset-password', lazy: () => import('./routes/reset-password') },
      // Printable pages: signed in, without the rails (a clean preview that prints as it shows).
      {
        element: (
          <RequireAuth>
            <Outlet />
          </RequireAuth>
        ),
        children: [
          { path: '/teardowns/:id/report', lazy: () => import('./routes/teardown-report') },
          { path: '/lineups/:id/print', lazy: () => import('./routes/lineup-print') },
        ],
      },
      {
        element: (
          <RequireAuth>
            <Shell />
          </RequireAuth>
        ),
        children: [
          { index: true, lazy: () => import('./routes/home') },
          { path: '/teardowns/:id/:section?', lazy: () => import('./routes/teardown') },
          { path: '/account', lazy: () => import('./routes/account') },
          { path: '/admin/users', lazy: () => import('./routes/admin-users') },
          { path: '/admin/invitations', lazy: () => import('./routes/admin-invitations') },
          { path: '/admin/outbox', lazy: () => import('./routes/admin-outbox') },
          { path: '/admin/audit', lazy: () => import('./routes/admin-audit') },
          { path: '/admin/figures', lazy: () => import('./routes/admin-figures') },
          { path: '/tools', lazy: () => import('./routes/bench-tools') },
          { path: '/rates', lazy: () => import('./routes/rates') },
          { path: '/bench/runs', lazy: () => import('./routes/bench-runs') },
          { path: '/devices', lazy: () => import('./routes/devices') },
          { path: '/devices/new', lazy: () => import('./routes/device-new') },
          { path: '/devices/:id', lazy: () => import('./routes/device') },
          { path: '/devices/:id/edit', lazy: () => import('./routes/device-edit') },
          { path: '/findings', lazy: () => import('./routes/findings') },
          { path: '/lineups', lazy: () => import('./routes/lineups') },
          { path: '/lineups/new', lazy: () => import('./routes/lineup-new') },
          { path: '/lineups/:id', lazy: () => import('./routes/lineup') },
          { path: '/lineups/:id/edit', lazy: () => import('./routes/lineup-edit') },
          { path: '*', lazy: () => import('./routes/not-found') },
        ],
      },
    ],
  },
]);
