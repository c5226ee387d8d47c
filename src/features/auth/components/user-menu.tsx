import { Link, useNavigate } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { useMe } from '../api/session';
import { useSignOut } from '../api/sign-out';

const roleLabel = { player: 'Player', teacher: 'Teacher', admin: 'Admin' } as const;

/** The corner of the header: who is signed in, their settings, and sign-out; or a sign-in link. */
export function UserMenu() {
  const { user, isLoading } = useMe();
  const signOut = useSignOut();
  const navigate = useNavigate();
  if (isLoading) return null;
  if (!user) {
    return (
      <Link to="/sign-in" className="rounded-md px-3 py-2 text-body font-semibold text-muted hover:text-text">
        Sign in
      </Link>
    );
  }
  return (
    <div className="flex items-center gap-2">
      <Link
        to="/account"
        className="rounded-md px-2 py-1 text-right leading-tight hover:bg-surface"
        title="Account settings"
      >
        <span className="block text-body font-semibold" data-testid="signed-in-name">
          {user.name}
        </span>
        <span className="block text-caption text-muted">{roleLabel[user.role]}</span>
      </Link>
      <Button
        variant="quiet"
        disabled={signOut.isPending}
        onClick={() => signOut.mutate(undefined, { onSettled: () => navigate('/sign-in') })}
      >
        Sign out
      </Button>
    </div>
  );
}
