import { Navigate } from 'react-router-dom';
import { useMe } from '@/features/auth/api/session';
import { LandingRoute } from './landing';

/** `/`: the landing page for visitors, the home page for anyone signed in. */
export function IndexRoute() {
  const { user, isLoading } = useMe();
  if (isLoading) return null;
  if (user) return <Navigate to="/home" replace />;
  return <LandingRoute />;
}
