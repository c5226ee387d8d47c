import { useParams } from 'react-router-dom';
import { WeeklyByDrill } from '@/features/maps/components/weekly-by-drill';
import { PlayerReview } from '@/features/studios/components/player-review';

export function StudioPlayerRoute() {
  const { id = '', playerId = '' } = useParams();
  return (
    <div className="grid gap-8">
      <PlayerReview studioId={id} playerId={playerId} />
      <WeeklyByDrill filters={{ player: playerId }} />
    </div>
  );
}
