/**
 * A long history for one player: 2,000 takes of 500 notes (1,000,000 per-note results) over a
 * year, through createTake like any take, so the maps read summaries of real results.
 * `node --import tsx scripts/seed-history.ts [notes]` seeds the bench database; the maps bench
 * calls seedLongHistory itself. Skips when the player already holds that many notes.
 */
import { sql } from 'drizzle-orm';
import { type DrillSpec, inAllKeys, type PlayedNote } from '../shared/engine';
import type { Db } from '../server/db/client';
import { users } from '../server/db/schema';
import { prng, prngUuid } from '../server/db/seed/history';
import { hashPassword } from '../server/services/auth/password-hash';
import { createTake } from '../server/services/takes/create';

export const LONG_HISTORY_EMAIL = 'bench@sixfold.test';
export const NOTES_PER_TAKE = 500;

/** A 500-note take: scale-steps up and down the piano, stopped after its 500th note. */
export function longTakeSpecs(): DrillSpec[] {
  return inAllKeys(
    {
      pair: ['D', 'C'],
      pattern: 'scale-steps',
      direction: 'up-down',
      range: { low: 21, high: 108 },
      instrument: 'piano',
      tempo: 160,
    },
    'fourths',
  ).map((d) => d.spec);
}

export function longTake(spec: DrillSpec, rand: () => number) {
  const [drill] = inAllKeys(spec, 'chromatic');
  const ms = 60000 / (spec.tempo ?? 120);
  const notes = drill.notes.slice(0, NOTES_PER_TAKE);
  const stoppedAtMs = notes.at(-1)!.beat * ms + 1;
  const played: PlayedNote[] = [];
  for (const n of notes) {
    const r = rand();
    if (r < 0.04) continue; // missed
    const slip = r < 0.07 ? 1 : 0; // wrong note
    played.push({ midi: n.midi + slip, timeMs: Math.round(n.beat * ms + (rand() - 0.5) * 40), velocity: 80 });
  }
  return { played, stoppedAtMs, options: { tempo: spec.tempo ?? 120, mode: 'timed' as const } };
}

export async function ensureLongHistoryPlayer(db: Db): Promise<string> {
  await db
    .insert(users)
    .values({
      email: LONG_HISTORY_EMAIL,
      name: 'Bench Player',
      role: 'player',
      passwordHash: await hashPassword('bench-long-history'),
    })
    .onConflictDoNothing({ target: users.email });
  const { rows } = await db.execute<{ id: string }>(sql`SELECT id FROM users WHERE email = ${LONG_HISTORY_EMAIL}`);
  return rows[0].id;
}

export async function seedLongHistory(db: Db, notes = 1_000_000, log = console.log): Promise<string> {
  const playerId = await ensureLongHistoryPlayer(db);
  const { rows } = await db.execute<{ n: number }>(
    sql`SELECT COALESCE(sum(note_count), 0)::int AS n FROM takes WHERE player_id = ${playerId}`,
  );
  let have = rows[0].n;
  if (have >= notes) {
    log(`long history: ${have.toLocaleString('en')} note results already there`);
    return playerId;
  }
  const specs = longTakeSpecs();
  const rand = prng(have + 17);
  const total = Math.ceil((notes - have) / NOTES_PER_TAKE);
  const started = performance.now();
  const yearMs = 365 * 86_400_000;
  const now = Date.now();
  let i = 0;
  // Three takes in flight: the database's work overlaps the next take's scoring.
  const worker = async () => {
    while (i < total) {
      const k = i++;
      const spec = specs[k % specs.length];
      const take = longTake(spec, rand);
      const { take: row } = await createTake(db, {
        playerId,
        id: prngUuid(rand),
        spec,
        ...take,
        startedAt: new Date(now - yearMs + Math.floor((k / total) * yearMs)),
      });
      have += row.noteCount;
      if (k % 200 === 199) log(`  ${(k + 1).toLocaleString('en')} / ${total.toLocaleString('en')} takes`);
    }
  };
  await Promise.all([worker(), worker(), worker()]);
  log(
    `long history: ${have.toLocaleString('en')} note results in ${((performance.now() - started) / 1000).toFixed(1)} s`,
  );
  return playerId;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const { benchDatabase } = await import('./bench/bench-db');
  const { db, pool } = await benchDatabase(4);
  await seedLongHistory(db, Number(process.argv[2] ?? 1_000_000));
  await pool.end();
}
