import { sql } from 'drizzle-orm';
import type { PlayerSettings, UpdateSettingsInput } from '../../../shared/schemas/settings';
import type { Db } from '../../db/client';
import { playerSettings } from '../../db/schema/player-settings';
import { presentSettings } from './get';

/** Changes only the settings sent; the rest keep their values. */
export async function updateSettings(db: Db, userId: string, input: UpdateSettingsInput): Promise<PlayerSettings> {
  const values: Partial<typeof playerSettings.$inferInsert> = {};
  if (input.instrument !== undefined) values.instrument = input.instrument;
  if (input.writtenPitchInput !== undefined) values.writtenPitchInput = input.writtenPitchInput;
  if (input.octaveShift !== undefined) values.octaveShift = input.octaveShift;
  if (input.defaultTempo !== undefined) values.defaultTempo = input.defaultTempo;
  if (input.weeklyMinutesGoal !== undefined) values.weeklyMinutesGoal = input.weeklyMinutesGoal;
  if (input.range !== undefined) {
    values.rangeLow = input.range?.low ?? null;
    values.rangeHigh = input.range?.high ?? null;
  }
  const [row] = await db
    .insert(playerSettings)
    .values({ userId, ...values })
    .onConflictDoUpdate({ target: playerSettings.userId, set: { ...values, updatedAt: sql`now()` } })
    .returning();
  return presentSettings(row);
}
