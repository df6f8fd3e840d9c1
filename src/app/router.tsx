import { createBrowserRouter, redirect } from 'react-router';
import { AdminLayout } from '@/components/layout/admin-layout';
import { ADMIN_ONLY } from '@shared/domain/access';
import { AppShell } from '@/components/layout/app-shell';
import { RouteError } from '@/components/layout/route-error';
import { requireUser } from './auth-loader';

// Routes declared in code; each page is a lazy route module exporting Component (and loader, handle).
export const router = createBrowserRouter([
  { path: '/sign-in', lazy: () => import('./routes/auth/sign-in'), ErrorBoundary: RouteError },
  // The customer's read-only order status: public, outside the signed-in shell.
  { path: '/status/:token', lazy: () => import('./routes/public/order-status'), ErrorBoundary: RouteError },
  {
    id: 'signed-in',
    loader: requireUser,
    Component: AppShell,
    ErrorBoundary: RouteError,
    children: [
      {
        ErrorBoundary: RouteError,
        children: [
          { index: true, lazy: () => import('./routes/home/role-home') },
          {
            path: 'admin',
            Component: AdminLayout,
            handle: { roles: ADMIN_ONLY },
            children: [
              { index: true, loader: () => redirect('/admin/users') },
              { path: 'users', lazy: () => import('./routes/admin/users') },
              { path: 'stations', lazy: () => import('./routes/admin/stations') },
              { path: 'devices', lazy: () => import('./routes/admin/devices') },
              { path: 'reason-codes', lazy: () => import('./routes/admin/reason-codes') },
              { path: 'backups', lazy: () => import('./routes/admin/backups') },
              { path: 'outbox', lazy: () => import('./routes/admin/outbox') },
              { path: 'routing-templates', lazy: () => import('./routes/admin/routing-templates') },
            ],
          },
          { path: 'orders', lazy: () => import('./routes/orders/list') },
          { path: 'orders/new', lazy: () => import('./routes/orders/new') },
          { path: 'orders/import', lazy: () => import('./routes/orders/import') },
          { path: 'orders/:id', lazy: () => import('./routes/orders/detail') },
          { path: 'trays/:id', lazy: () => import('./routes/trays/detail') },
          { path: 'moulds', lazy: () => import('./routes/moulds/library') },
          { path: 'sales', lazy: () => import('./routes/sales/order-search') },
          { path: 'sales/orders/:id', lazy: () => import('./routes/sales/order-status') },
          { path: 'dispatch', lazy: () => import('./routes/dispatch/dispatch-list') },
          { path: 'dispatch/:id', lazy: () => import('./routes/dispatch/pack-and-ship') },
          { path: '*', lazy: () => import('./routes/errors/not-found') },
        ],
      },
    ],
  },
]);
