import { eq } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { takes } from '../../db/schema/takes';
import { notFound } from '../../errors';

/** Deletes a player's own take (its per-note rows go with it). Anyone else's: not found. */
export async function deleteTake(db: Db, playerId: string, takeId: string): Promise<void> {
  const take = await db.query.takes.findFirst({ where: (t, { eq: is }) => is(t.id, takeId) });
  if (!take || take.playerId !== playerId) throw notFound('That take');
  await db.delete(takes).where(eq(takes.id, takeId));
}
