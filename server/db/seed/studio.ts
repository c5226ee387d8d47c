import { and, desc, eq, sql } from 'drizzle-orm';
import type { DrillSpec as EngineSpec } from '../../../shared/engine';
import type { DrillSpec, KeyOrder } from '../../../shared/schemas/drills';
import { assignmentKeys } from '../../services/assignments/keys';
import type { Db } from '../client';
import { assignments, notifications, remarks, savedDrills, studios, takes, users } from '../schema';

/** The week's assignments of the demo week (docs/demo-scenario.md), on saved drills of the teacher's. */
const WEEK: {
  drill: string;
  spec: DrillSpec;
  keyOrder: KeyOrder;
  title: string;
  tempo: number;
  accuracy: number;
  note: string;
}[] = [
  {
    drill: 'Four-three on D/C over D7',
    spec: { pair: ['D', 'C'], pattern: 'four-three', direction: 'up', instrument: 'piano', tempo: 100, chord: 'D7' },
    keyOrder: 'chromatic',
    title: 'four-three on D/C, all keys, 100 bpm',
    tempo: 100,
    accuracy: 0.85,
    note: 'Keep the eighths even where the groups of seven cross the bar line.',
  },
  {
    drill: 'Scale-steps on Bbm/Ab over Bbm7',
    spec: {
      pair: ['Bbm', 'Ab'],
      pattern: 'scale-steps',
      direction: 'up',
      instrument: 'piano',
      tempo: 88,
      chord: 'Bbm7',
    },
    keyOrder: 'fourths',
    title: 'scale-steps on Bbm/Ab, fourths order',
    tempo: 88,
    accuracy: 0.85,
    note: 'Say the next key out loud before the count-in.',
  },
];

/** The Tuesday after `now`: the combo class, when the week's assignments are due. */
function nextTuesday(now = new Date()): Date {
  const d = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate(), 18));
  d.setUTCDate(d.getUTCDate() + ((2 - d.getUTCDay() + 7) % 7 || 7));
  return d;
}

async function ensureSavedDrill(
  db: Db,
  ownerId: string,
  name: string,
  spec: DrillSpec,
  keyOrder: KeyOrder,
): Promise<string> {
  const [found] = await db
    .select({ id: savedDrills.id })
    .from(savedDrills)
    .where(and(eq(savedDrills.ownerId, ownerId), eq(savedDrills.name, name)))
    .limit(1);
  if (found) return found.id;
  const [made] = await db
    .insert(savedDrills)
    .values({ ownerId, name, spec, keyOrder })
    .returning({ id: savedDrills.id });
  return made.id;
}

/**
 * Harbour Lane's week: two assignments, and (when the demo takes are there) a remark pinned to
 * a missed note of Theo's latest take. Checks for itself, so a rerun adds nothing twice.
 */
export async function seedStudioWeek(db: Db, studioId: string): Promise<void> {
  const [studio] = await db.select({ teacherId: studios.teacherId }).from(studios).where(eq(studios.id, studioId));
  if (!studio) return;
  const due = nextTuesday();
  for (const a of WEEK) {
    const drillId = await ensureSavedDrill(db, studio.teacherId, a.drill, a.spec, a.keyOrder);
    const [exists] = await db
      .select({ id: assignments.id })
      .from(assignments)
      .where(and(eq(assignments.studioId, studioId), eq(assignments.title, a.title)))
      .limit(1);
    if (exists) continue;
    const spec = { ...a.spec, tempo: a.tempo };
    await db.insert(assignments).values({
      studioId,
      setBy: studio.teacherId,
      savedDrillId: drillId,
      title: a.title,
      spec,
      keyOrder: a.keyOrder,
      keys: assignmentKeys(spec as EngineSpec, a.keyOrder),
      targetTempo: a.tempo,
      targetAccuracy: a.accuracy,
      dueAt: due,
      note: a.note,
      // set a few days ago, so this week's demo takes can count towards them
      createdAt: new Date(Date.now() - 4 * 86_400_000),
    });
  }

  // A remark on Theo's latest take with a missed note, if the demo takes were seeded.
  const [theo] = await db.select({ id: users.id }).from(users).where(eq(users.email, 'player@sixfold.test'));
  if (!theo) return;
  const [take] = await db
    .select({ id: takes.id, score: takes.score, key: takes.key, pair: takes.pair, pattern: takes.pattern })
    .from(takes)
    .where(and(eq(takes.playerId, theo.id), sql`${takes.score}->'results' @> '[{"verdict":"missed"}]'::jsonb`))
    .orderBy(desc(takes.startedAt))
    .limit(1);
  if (!take) return;
  const [already] = await db
    .select({ id: remarks.id })
    .from(remarks)
    .where(and(eq(remarks.takeId, take.id), eq(remarks.studioId, studioId)))
    .limit(1);
  if (already) return;
  const missed = take.score.results.findIndex((r) => r.verdict === 'missed');
  await db.insert(remarks).values([
    {
      takeId: take.id,
      studioId,
      authorId: studio.teacherId,
      noteIndex: missed,
      body: `This is the note that keeps slipping in ${take.key}. Play the two cells around it slowly, then put it back in at tempo.`,
    },
    {
      takeId: take.id,
      studioId,
      authorId: studio.teacherId,
      noteIndex: null,
      body: 'The flat keys sound settled now. Give B, E and F# the first ten minutes of each session this week.',
    },
  ]);
  await db.insert(notifications).values({
    userId: theo.id,
    kind: 'remark',
    text: `Mara Quill left a remark on ${take.pair} ${take.pattern} in ${take.key}`,
    link: `/takes/${take.id}`,
  });
}
