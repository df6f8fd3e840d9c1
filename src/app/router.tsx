import { createBrowserRouter } from 'react-router';
import { AppShell } from '@/components/layout/app-shell';
import { RouteError } from '@/components/layout/route-error';
import { requireUser } from './auth-loader';

// Routes declared in code; each page is a lazy route module exporting Component (and loader, handle).
export const router = createBrowserRouter([
  { path: '/sign-in', lazy: () => import('./routes/auth/sign-in'), ErrorBoundary: RouteError },
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
          { path: 'admin', lazy: () => import('./routes/home/role-home') },
          { path: 'admin/users', lazy: () => import('./routes/admin/users') },
          { path: 'admin/stations', lazy: () => import('./routes/admin/stations') },
          { path: 'admin/devices', lazy: () => import('./routes/admin/devices') },
          { path: '*', lazy: () => import('./routes/errors/not-found') },
        ],
      },
    ],
  },
]);
