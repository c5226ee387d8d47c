import type { Role } from '@shared/schemas/auth';
import type { ReactNode } from 'react';
import { Navigate, useLocation } from 'react-router-dom';
import { useMe } from '@/features/auth/api/session';
import { safeNext } from '@/features/auth/components/safe-next';
import { NotForRoleRoute } from './routes/not-for-role';

function Checking() {
  return (
    <p role="status" className="py-16 text-center text-muted">
      Checking who you are…
    </p>
  );
}

/**
 * Mirrors the server's rules in the browser: signed out -> the sign-in page (and back after),
 * a role that may not use the page -> a page that says so. The server still checks every call.
 */
export function RequireRole({ roles, children }: { roles?: Role[]; children: ReactNode }) {
  const { user, isLoading } = useMe();
  const location = useLocation();
  if (isLoading) return <Checking />;
  if (!user) {
    const next = `${location.pathname}${location.search}`;
    return <Navigate to={`/sign-in?next=${encodeURIComponent(next)}`} replace />;
  }
  if (roles && !roles.includes(user.role)) return <NotForRoleRoute role={user.role} />;
  return <>{children}</>;
}

/** Pages for visitors only (sign-in, sign-up): a signed-in user goes to their home page. */
export function VisitorsOnly({ children }: { children: ReactNode }) {
  const { user, isLoading } = useMe();
  const location = useLocation();
  if (isLoading) return <Checking />;
  // Signed in (just now, or already): on to where they were going, else their home page.
  if (user) return <Navigate to={safeNext(new URLSearchParams(location.search).get('next'))} replace />;
  return <>{children}</>;
}
