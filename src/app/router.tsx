import { createBrowserRouter, redirect } from 'react-router';
import { AdminLayout } from '@/components/layout/admin-layout';
import { ADMIN_ONLY } from '@shared/domain/access';
import { AppShell } from '@/components/layout/app-shell';
import { RouteError } from '@/components/layout/route-error';
import { requireUser } from './auth-loader';

// Routes declared in code; each page is a lazy route module exporting Component (and loader, handle).
export const router = createBrowserRouter([
  { path: '/sign-in', lazy: () => import('./routes/auth/sign-in'), ErrorBoundary: RouteError },
  // A first admin on the default password chooses a new one here before anything else opens.
  { path: '/change-password', lazy: () => import('./routes/auth/change-password'), ErrorBoundary: RouteError },
  // The station tablet: full screen, outside the signed-in shell (it signs operators in itself and works offline).
  { path: '/station', lazy: () => import('./routes/station/station'), ErrorBoundary: RouteError },
  { path: '/pair', lazy: () => import('./routes/station/pair'), ErrorBoundary: RouteError },
  // The customer's read-only order status: public, outside the signed-in shell.
  { path: '/status/:token', lazy: () => import('./routes/public/order-status'), ErrorBoundary: RouteError },
  // The customer's quotation from the mail: accept one quantity, which places the order.
  { path: '/quote/:token', lazy: () => import('./routes/public/quote'), ErrorBoundary: RouteError },
  // The floor wall: full screen, for a paired wall display or a signed-in supervisor.
  { path: '/wall', lazy: () => import('./routes/wall/wall'), ErrorBoundary: RouteError },
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
              { path: 'calendar', lazy: () => import('./routes/admin/calendar') },
              { path: 'routing-templates', lazy: () => import('./routes/admin/routing-templates') },
              { path: 'costing', lazy: () => import('./routes/admin/costing') },
              { path: 'settings', lazy: () => import('./routes/admin/settings') },
            ],
          },
          { path: 'orders', lazy: () => import('./routes/orders/list') },
          { path: 'orders/new', lazy: () => import('./routes/orders/new') },
          { path: 'orders/import', lazy: () => import('./routes/orders/import') },
          { path: 'orders/:id', lazy: () => import('./routes/orders/detail') },
          { path: 'quotes', lazy: () => import('./routes/quotes/list') },
          { path: 'quotes/new', lazy: () => import('./routes/quotes/new') },
          { path: 'quotes/:id', lazy: () => import('./routes/quotes/detail') },
          { path: 'trays/:id', lazy: () => import('./routes/trays/detail') },
          { path: 'moulds', lazy: () => import('./routes/moulds/library') },
          { path: 'floor', lazy: () => import('./routes/floor/floor') },
          { path: 'loads', lazy: () => import('./routes/loads/loads') },
          {
            path: 'reports',
            lazy: () => import('./routes/reports/layout'),
            children: [
              // the manager's home: one summary page (sales, who may read only some reports, go on to lead time)
              { index: true, lazy: () => import('./routes/reports/summary') },
              { path: 'lead-time', lazy: () => import('./routes/reports/lead-time') },
              { path: 'cycle-time', lazy: () => import('./routes/reports/cycle-time') },
              { path: 'flow', lazy: () => import('./routes/reports/flow') },
              { path: 'on-time', lazy: () => import('./routes/reports/on-time') },
              { path: 'yield', lazy: () => import('./routes/reports/yield') },
              { path: 'costing', lazy: () => import('./routes/reports/costing') },
            ],
          },
          { path: 'sales', lazy: () => import('./routes/sales/order-search') },
          { path: 'sales/when', lazy: () => import('./routes/sales/when') },
          { path: 'sales/orders/:id', lazy: () => import('./routes/sales/order-status') },
          { path: 'dispatch', lazy: () => import('./routes/dispatch/dispatch-list') },
          { path: 'dispatch/:id', lazy: () => import('./routes/dispatch/pack-and-ship') },
          { path: 'exceptions', lazy: () => import('./routes/floor/scan-exceptions') },
          { path: '*', lazy: () => import('./routes/errors/not-found') },
        ],
      },
    ],
  },
]);
