import type { Db } from '../../db/client';
import { notFound } from '../../errors';
import { teachesPlayer } from '../takes/get';

/**
 * Whose takes and maps a request reads: the viewer's own, or (a teacher passing `player`) a
 * player of a studio they teach. Anyone else's id is "not found", so it reveals nothing.
 */
export async function subjectPlayerId(db: Db, viewer: { id: string; role: string }, player?: string): Promise<string> {
  if (!player || player === viewer.id) return viewer.id;
  if (viewer.role === 'teacher' && (await teachesPlayer(db, viewer.id, player))) return player;
  throw notFound('That player');
}
