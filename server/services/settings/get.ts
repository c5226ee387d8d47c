import type { PlayerSettings } from '../../../shared/schemas/settings';
import type { Db } from '../../db/client';
import type { PlayerSettingsRow } from '../../db/schema/player-settings';

export const DEFAULT_SETTINGS: PlayerSettings = {
  instrument: 'piano',
  writtenPitchInput: false,
  octaveShift: 0,
  range: null,
  defaultTempo: 100,
  latency: {},
  weeklyMinutesGoal: null,
};

export function presentSettings(row: PlayerSettingsRow | undefined): PlayerSettings {
  if (!row) return DEFAULT_SETTINGS;
  return {
    instrument: row.instrument as PlayerSettings['instrument'],
    writtenPitchInput: row.writtenPitchInput,
    octaveShift: row.octaveShift,
    range: row.rangeLow !== null && row.rangeHigh !== null ? { low: row.rangeLow, high: row.rangeHigh } : null,
    defaultTempo: row.defaultTempo,
    latency: row.latency,
    weeklyMinutesGoal: row.weeklyMinutesGoal ?? null,
  };
}

/** A user's practice settings, or the defaults before they set any. */
export async function getSettings(db: Db, userId: string): Promise<PlayerSettings> {
  const row = await db.query.playerSettings.findFirst({ where: (t, { eq }) => eq(t.userId, userId) });
  return presentSettings(row);
}
