import { sql } from 'drizzle-orm';
import type { PlayerSettings } from '../../../shared/schemas/settings';
import type { Db } from '../../db/client';
import { playerSettings } from '../../db/schema/player-settings';
import { presentSettings } from './get';

/** Stores one input device's measured latency, keeping the other devices'. */
export async function setLatency(db: Db, userId: string, device: string, offsetMs: number): Promise<PlayerSettings> {
  const entry = { [device]: Math.round(offsetMs * 10) / 10 };
  const [row] = await db
    .insert(playerSettings)
    .values({ userId, latency: entry })
    .onConflictDoUpdate({
      target: playerSettings.userId,
      set: { latency: sql`${playerSettings.latency} || ${JSON.stringify(entry)}::jsonb`, updatedAt: sql`now()` },
    })
    .returning();
  return presentSettings(row);
}
