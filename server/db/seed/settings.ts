import type { Db } from '../client';
import { playerSettings } from '../schema/player-settings';

/**
 * The demo players' practice settings (docs/demo-scenario.md): Theo on an 88-key piano, Ines reading alto
 * parts on a keyboard in written pitch, Sam on a wind controller. Set once; a player's own later
 * changes are kept.
 */
export async function seedDemoSettings(db: Db, ids: Map<string, string>): Promise<void> {
  const rows = [
    { email: 'player@sixfold.test', instrument: 'piano', writtenPitchInput: false, defaultTempo: 96 },
    { email: 'alto@sixfold.test', instrument: 'alto-sax', writtenPitchInput: true, defaultTempo: 100 },
    { email: 'wind@sixfold.test', instrument: 'wind-controller', writtenPitchInput: false, defaultTempo: 108 },
  ];
  for (const r of rows) {
    const userId = ids.get(r.email);
    if (!userId) continue;
    await db
      .insert(playerSettings)
      .values({
        userId,
        instrument: r.instrument,
        writtenPitchInput: r.writtenPitchInput,
        defaultTempo: r.defaultTempo,
      })
      .onConflictDoNothing({ target: playerSettings.userId });
  }
}
