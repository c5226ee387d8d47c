import { createBrowserRouter, RouterProvider } from 'react-router-dom';
import { RequireRole, VisitorsOnly } from './guards';
import { RootLayout } from './root-layout';
import { AccountRoute } from './routes/account';
import { AdminAuditRoute } from './routes/admin-audit';
import { AdminPurchasesRoute } from './routes/admin-purchases';
import { AdminUsersRoute } from './routes/admin-users';
import { BookRoute } from './routes/book';
import { BookEditRoute } from './routes/book-edit';
import { BookPrintRoute } from './routes/book-print';
import { BookSalesRoute } from './routes/book-sales';
import { BooksRoute } from './routes/books';
import { DrillsRoute } from './routes/drills';
import { DrillsPrintRoute } from './routes/drills-print';
import { ForgotPasswordRoute } from './routes/forgot-password';
import { HistoryRoute } from './routes/history';
import { HistoryTakeRoute } from './routes/history-take';
import { HomeRoute } from './routes/home';
import { IndexRoute } from './routes/index';
import { InputCheckRoute } from './routes/input-check';
import { InviteRoute } from './routes/invite';
import { PracticeRoute } from './routes/practice';
import { ProgressRoute } from './routes/progress';
import { NotFoundRoute } from './routes/not-found';
import { ResetPasswordRoute } from './routes/reset-password';
import { SignInRoute } from './routes/sign-in';
import { SignUpRoute } from './routes/sign-up';
import { StudioDetailRoute } from './routes/studio-detail';
import { StudioListRoute } from './routes/studio-list';
import { StudioPlayerRoute } from './routes/studio-player';
import { TakeRoute } from './routes/take';

const router = createBrowserRouter([
  {
    element: <RootLayout />,
    children: [
      { path: '/', element: <IndexRoute /> },
      { path: '/sign-in', element: <VisitorsOnly><SignInRoute /></VisitorsOnly> },
      { path: '/sign-up', element: <VisitorsOnly><SignUpRoute /></VisitorsOnly> },
      { path: '/forgot-password', element: <ForgotPasswordRoute /> },
      { path: '/reset-password', element: <ResetPasswordRoute /> },
      { path: '/input', element: <InputCheckRoute /> },
      { path: '/practice', element: <RequireRole roles={['player']}><PracticeRoute /></RequireRole> },
      { path: '/home', element: <RequireRole><HomeRoute /></RequireRole> },
      { path: '/account', element: <RequireRole><AccountRoute /></RequireRole> },
      { path: '/drills', element: <RequireRole><DrillsRoute /></RequireRole> },
      { path: '/drills/print', element: <RequireRole><DrillsPrintRoute /></RequireRole> },
      { path: '/admin/users', element: <RequireRole roles={['admin']}><AdminUsersRoute /></RequireRole> },
      { path: '/admin/audit', element: <RequireRole roles={['admin']}><AdminAuditRoute /></RequireRole> },
      { path: '/studio', element: <RequireRole><StudioListRoute /></RequireRole> },
      { path: '/studio/:id', element: <RequireRole><StudioDetailRoute /></RequireRole> },
      { path: '/studio/:id/players/:playerId', element: <RequireRole roles={['teacher', 'admin']}><StudioPlayerRoute /></RequireRole> },
      { path: '/takes/:id', element: <RequireRole><TakeRoute /></RequireRole> },
      { path: '/history', element: <RequireRole roles={['player', 'teacher']}><HistoryRoute /></RequireRole> },
      { path: '/history/:id', element: <RequireRole roles={['player', 'teacher']}><HistoryTakeRoute /></RequireRole> },
      { path: '/progress', element: <RequireRole roles={['player', 'teacher']}><ProgressRoute /></RequireRole> },
      { path: '/invite', element: <InviteRoute /> },
      { path: '/books', element: <BooksRoute /> },
      { path: '/books/sales', element: <RequireRole roles={['teacher']}><BookSalesRoute /></RequireRole> },
      { path: '/books/:id', element: <BookRoute /> },
      { path: '/books/:id/edit', element: <RequireRole roles={['teacher']}><BookEditRoute /></RequireRole> },
      { path: '/books/:id/print', element: <BookPrintRoute /> },
      { path: '/admin/purchases', element: <RequireRole roles={['admin']}><AdminPurchasesRoute /></RequireRole> },
      { path: '*', element: <NotFoundRoute /> },
    ],
  },
]);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
