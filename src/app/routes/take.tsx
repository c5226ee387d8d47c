import { useParams } from 'react-router-dom';
import { useMe } from '@/features/auth/api/session';
import { TakeReview } from '@/features/studios/components/take-review';

export function TakeRoute() {
  const { id = '' } = useParams();
  const { user } = useMe();
  if (!user) return null;
  return <TakeReview takeId={id} viewerId={user.id} />;
}
