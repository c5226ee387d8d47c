import { useParams } from 'react-router-dom';
import { PlayerReview } from '@/features/studios/components/player-review';

export function StudioPlayerRoute() {
  const { id = '', playerId = '' } = useParams();
  return <PlayerReview studioId={id} playerId={playerId} />;
}
