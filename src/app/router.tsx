import { createBrowserRouter, RouterProvider } from 'react-router-dom';
import { RequireRole, VisitorsOnly } from './guards';
import { RootLayout } from './root-layout';
import { AccountRoute } from './routes/account';
import { AdminUsersRoute } from './routes/admin-users';
import { DrillsRoute } from './routes/drills';
import { DrillsPrintRoute } from './routes/drills-print';
import { ForgotPasswordRoute } from './routes/forgot-password';
import { HomeRoute } from './routes/home';
import { IndexRoute } from './routes/index';
import { InputCheckRoute } from './routes/input-check';
import { NotFoundRoute } from './routes/not-found';
import { ResetPasswordRoute } from './routes/reset-password';
import { SignInRoute } from './routes/sign-in';
import { SignUpRoute } from './routes/sign-up';

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
      { path: '/home', element: <RequireRole><HomeRoute /></RequireRole> },
      { path: '/account', element: <RequireRole><AccountRoute /></RequireRole> },
      { path: '/drills', element: <RequireRole><DrillsRoute /></RequireRole> },
      { path: '/drills/print', element: <RequireRole><DrillsPrintRoute /></RequireRole> },
      { path: '/admin/users', element: <RequireRole roles={['admin']}><AdminUsersRoute /></RequireRole> },
      { path: '*', element: <NotFoundRoute /> },
    ],
  },
]);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
