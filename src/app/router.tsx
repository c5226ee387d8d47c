import type { Role } from '@shared/schemas/auth';
import type { ComponentType } from 'react';
import { createBrowserRouter, RouterProvider, type RouteObject } from 'react-router-dom';
import { RequireRole, VisitorsOnly } from './guards';
import { RootLayout } from './root-layout';
import { RouteError } from './route-error';
import { IndexRoute } from './routes/index';
import { NotFoundRoute } from './routes/not-found';
import { SignInRoute } from './routes/sign-in';

type Guard = 'public' | 'visitors' | 'signed-in' | Role[];

/**
 * A page loaded on first visit (its own chunk), wrapped in the guard that mirrors the server's
 * rule for it: public, any signed-in user, or only some roles.
 */
function page<M extends Record<string, unknown>>(
  path: string,
  load: () => Promise<M>,
  name: keyof M & string,
  guard: Guard,
): RouteObject {
  return {
    path,
    lazy: async () => {
      const Component = (await load())[name] as ComponentType;
      if (guard === 'public') return { element: <Component /> };
      if (guard === 'visitors')
        return {
          element: (
            <VisitorsOnly>
              <Component />
            </VisitorsOnly>
          ),
        };
      return {
        element: (
          <RequireRole roles={guard === 'signed-in' ? undefined : guard}>
            <Component />
          </RequireRole>
        ),
      };
    },
  };
}

const router = createBrowserRouter([
  {
    element: <RootLayout />,
    errorElement: <RouteError />,
    // Pages' errors show inside the app shell, so the navigation stays.
    children: [
      {
        errorElement: <RouteError />,
        children: [
          { path: '/', element: <IndexRoute /> },
          {
            path: '/sign-in',
            element: (
              <VisitorsOnly>
                <SignInRoute />
              </VisitorsOnly>
            ),
          },
          page('/sign-up', () => import('./routes/sign-up'), 'SignUpRoute', 'visitors'),
          page('/forgot-password', () => import('./routes/forgot-password'), 'ForgotPasswordRoute', 'public'),
          page('/reset-password', () => import('./routes/reset-password'), 'ResetPasswordRoute', 'public'),
          page('/home', () => import('./routes/home'), 'HomeRoute', 'signed-in'),
          page('/input', () => import('./routes/input-check'), 'InputCheckRoute', 'public'),
          page('/practice', () => import('./routes/practice'), 'PracticeRoute', ['player']),
          page('/account', () => import('./routes/account'), 'AccountRoute', 'signed-in'),
          page('/drills', () => import('./routes/drills'), 'DrillsRoute', 'signed-in'),
          page('/drills/print', () => import('./routes/drills-print'), 'DrillsPrintRoute', 'signed-in'),
          page('/admin/users', () => import('./routes/admin-users'), 'AdminUsersRoute', ['admin']),
          page('/admin/audit', () => import('./routes/admin-audit'), 'AdminAuditRoute', ['admin']),
          page('/admin/purchases', () => import('./routes/admin-purchases'), 'AdminPurchasesRoute', ['admin']),
          page('/studio', () => import('./routes/studio-list'), 'StudioListRoute', 'signed-in'),
          page('/studio/:id', () => import('./routes/studio-detail'), 'StudioDetailRoute', 'signed-in'),
          page('/studio/:id/players/:playerId', () => import('./routes/studio-player'), 'StudioPlayerRoute', [
            'teacher',
            'admin',
          ]),
          page('/takes/:id', () => import('./routes/take'), 'TakeRoute', 'signed-in'),
          page('/history', () => import('./routes/history'), 'HistoryRoute', ['player', 'teacher']),
          page('/history/:id', () => import('./routes/history-take'), 'HistoryTakeRoute', ['player', 'teacher']),
          page('/progress', () => import('./routes/progress'), 'ProgressRoute', ['player', 'teacher']),
          page('/invite', () => import('./routes/invite'), 'InviteRoute', 'public'),
          page('/books', () => import('./routes/books'), 'BooksRoute', 'public'),
          page('/books/sales', () => import('./routes/book-sales'), 'BookSalesRoute', ['teacher']),
          page('/books/:id', () => import('./routes/book'), 'BookRoute', 'public'),
          page('/books/:id/edit', () => import('./routes/book-edit'), 'BookEditRoute', ['teacher']),
          page('/books/:id/print', () => import('./routes/book-print'), 'BookPrintRoute', 'public'),
          { path: '*', element: <NotFoundRoute /> },
        ],
      },
    ],
  },
]);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
