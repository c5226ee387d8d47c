import { useSearchParams } from 'react-router-dom';
import { useMe } from '@/features/auth/api/session';
import { InvitePanel } from '@/features/studios/components/invite-panel';

/** Where the e-mailed invite link lands; open to visitors and signed-in users alike. */
export function InviteRoute() {
  const [params] = useSearchParams();
  const { user, isLoading } = useMe();
  if (isLoading) return <p className="text-muted">Checking who you are…</p>;
  return <InvitePanel token={params.get('token') ?? ''} signedInAs={user ?? null} />;
}
