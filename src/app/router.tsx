import type { Role } from '@shared/schemas/auth';
import { type ComponentType, lazy, type ReactNode, Suspense } from 'react';
import { BrowserRouter, Outlet, Route, Routes, useLocation } from 'react-router-dom';
import { RequireRole, VisitorsOnly } from './guards';
import { RootLayout } from './root-layout';
import { RouteErrorBoundary } from './route-error';
import { IndexRoute } from './routes/index';
import { NotFoundRoute } from './routes/not-found';

type Guard = 'public' | 'visitors' | 'signed-in' | Role[];

interface PageDef {
  path: string;
  load: () => Promise<Record<string, unknown>>;
  name: string;
  guard: Guard;
}

/**
 * Every page but the first ones a visitor meets is loaded on first visit (its own chunk), and
 * wrapped in the guard that mirrors the server's rule for it: public, visitors only, any
 * signed-in user, or only some roles. The router runs in its declarative form, which keeps the
 * first page light.
 */
const PAGES: PageDef[] = [
  { path: '/sign-in', load: () => import('./routes/sign-in'), name: 'SignInRoute', guard: 'visitors' },
  { path: '/sign-up', load: () => import('./routes/sign-up'), name: 'SignUpRoute', guard: 'visitors' },
  {
    path: '/forgot-password',
    load: () => import('./routes/forgot-password'),
    name: 'ForgotPasswordRoute',
    guard: 'public',
  },
  {
    path: '/reset-password',
    load: () => import('./routes/reset-password'),
    name: 'ResetPasswordRoute',
    guard: 'public',
  },
  { path: '/home', load: () => import('./routes/home'), name: 'HomeRoute', guard: 'signed-in' },
  { path: '/input', load: () => import('./routes/input-check'), name: 'InputCheckRoute', guard: 'public' },
  { path: '/practice', load: () => import('./routes/practice'), name: 'PracticeRoute', guard: ['player'] },
  { path: '/account', load: () => import('./routes/account'), name: 'AccountRoute', guard: 'signed-in' },
  { path: '/drills', load: () => import('./routes/drills'), name: 'DrillsRoute', guard: 'signed-in' },
  { path: '/drills/print', load: () => import('./routes/drills-print'), name: 'DrillsPrintRoute', guard: 'signed-in' },
  { path: '/admin/users', load: () => import('./routes/admin-users'), name: 'AdminUsersRoute', guard: ['admin'] },
  { path: '/admin/audit', load: () => import('./routes/admin-audit'), name: 'AdminAuditRoute', guard: ['admin'] },
  {
    path: '/admin/purchases',
    load: () => import('./routes/admin-purchases'),
    name: 'AdminPurchasesRoute',
    guard: ['admin'],
  },
  { path: '/studio', load: () => import('./routes/studio-list'), name: 'StudioListRoute', guard: 'signed-in' },
  { path: '/studio/:id', load: () => import('./routes/studio-detail'), name: 'StudioDetailRoute', guard: 'signed-in' },
  {
    path: '/studio/:id/players/:playerId',
    load: () => import('./routes/studio-player'),
    name: 'StudioPlayerRoute',
    guard: ['teacher', 'admin'],
  },
  { path: '/takes/:id', load: () => import('./routes/take'), name: 'TakeRoute', guard: 'signed-in' },
  { path: '/history', load: () => import('./routes/history'), name: 'HistoryRoute', guard: ['player', 'teacher'] },
  {
    path: '/history/:id',
    load: () => import('./routes/history-take'),
    name: 'HistoryTakeRoute',
    guard: ['player', 'teacher'],
  },
  { path: '/progress', load: () => import('./routes/progress'), name: 'ProgressRoute', guard: ['player', 'teacher'] },
  { path: '/invite', load: () => import('./routes/invite'), name: 'InviteRoute', guard: 'public' },
  { path: '/books', load: () => import('./routes/books'), name: 'BooksRoute', guard: 'public' },
  { path: '/books/sales', load: () => import('./routes/book-sales'), name: 'BookSalesRoute', guard: ['teacher'] },
  { path: '/books/:id', load: () => import('./routes/book'), name: 'BookRoute', guard: 'public' },
  { path: '/books/:id/edit', load: () => import('./routes/book-edit'), name: 'BookEditRoute', guard: ['teacher'] },
  { path: '/books/:id/print', load: () => import('./routes/book-print'), name: 'BookPrintRoute', guard: 'public' },
];

function guarded(guard: Guard, element: ReactNode): ReactNode {
  if (guard === 'public') return element;
  if (guard === 'visitors') return <VisitorsOnly>{element}</VisitorsOnly>;
  return <RequireRole roles={guard === 'signed-in' ? undefined : guard}>{element}</RequireRole>;
}

const lazyPages = PAGES.map((p) => ({
  ...p,
  Component: lazy(async () => ({ default: (await p.load())[p.name] as ComponentType })),
}));

function Loading() {
  return (
    <p role="status" className="py-16 text-center text-muted">
      Loading…
    </p>
  );
}

/** Pages' errors show inside the app shell, so the navigation stays; a new page starts clean. */
function PageFrame() {
  const location = useLocation();
  return (
    <RouteErrorBoundary key={location.pathname}>
      <Suspense fallback={<Loading />}>
        <Outlet />
      </Suspense>
    </RouteErrorBoundary>
  );
}

export function AppRouter() {
  return (
    <BrowserRouter>
      <RouteErrorBoundary>
        <Routes>
          <Route element={<RootLayout />}>
            <Route element={<PageFrame />}>
              <Route path="/" element={<IndexRoute />} />
              {lazyPages.map(({ path, guard, Component }) => (
                <Route key={path} path={path} element={guarded(guard, <Component />)} />
              ))}
              <Route path="*" element={<NotFoundRoute />} />
            </Route>
          </Route>
        </Routes>
      </RouteErrorBoundary>
    </BrowserRouter>
  );
}
