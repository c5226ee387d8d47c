import { sql } from 'drizzle-orm';
import type { DrillSpec, PlayedNote, ScoreOptions } from '../../../shared/engine';
import type { InputKind } from '../../../shared/schemas/takes';
import type { Db } from '../../db/client';
import { type TakeRow, takes } from '../../db/schema/takes';
import { AppError } from '../../errors';
import { climbTempo } from '../practice/climb-tempo';
import { takeDurationMs } from './duration';
import { scoreRawTake } from './score-take';

export interface CreateTakeArgs {
  playerId: string;
  id: string;
  spec: DrillSpec;
  played: PlayedNote[];
  options: ScoreOptions;
  startedAt: Date;
  measures?: [number, number] | null;
  stoppedAtMs?: number | null;
  assignmentId?: string | null;
  inputKind?: InputKind | null;
}

/**
 * Scores and stores a take with its per-note results in one transaction. The client's id makes
 * it idempotent: the same id again returns the stored take (created: false), never a copy.
 */
export async function createTake(db: Db, args: CreateTakeArgs): Promise<{ take: TakeRow; created: boolean }> {
  const existing = await db.query.takes.findFirst({ where: (t, { eq }) => eq(t.id, args.id) });
  if (existing) return sameOwner(existing, args.playerId);

  const scored = scoreRawTake(args);
  const { drill, score } = scored;
  const meter = `${drill.spec.meter[0]}/${drill.spec.meter[1]}`;

  return db.transaction(async (tx) => {
    const inserted = await tx
      .insert(takes)
      .values({
        id: args.id,
        playerId: args.playerId,
        assignmentId: args.assignmentId ?? null,
        spec: drill.spec,
        options: scored.options,
        measureFrom: args.measures?.[0] ?? null,
        measureTo: args.measures?.[1] ?? null,
        stoppedAtMs: args.stoppedAtMs ?? null,
        inputKind: args.inputKind ?? null,
        played: args.played,
        score,
        key: scored.key,
        pattern: scored.pattern,
        pair: scored.pair,
        instrument: drill.spec.instrument,
        tempo: drill.spec.tempo,
        accuracy: score.accuracy,
        meanOffsetMs: score.meanOffsetMs,
        noteCount: scored.expected.length,
        durationMs: takeDurationMs(scored.expected, args.played, drill.spec.tempo, args.stoppedAtMs),
        startedAt: args.startedAt,
      })
      .onConflictDoNothing({ target: takes.id })
      .returning();
    if (inserted.length === 0) {
      // Another request with the same id won the race; answer with what it stored.
      const row = await tx.query.takes.findFirst({ where: (t, { eq }) => eq(t.id, args.id) });
      if (!row) throw new AppError('conflict', 'The take could not be stored; send it again');
      return sameOwner(row, args.playerId);
    }
    const rows = scored.expected.map((n, i) => ({
      idx: i,
      midi: n.midi,
      beat: n.beat,
      measure: n.measure,
      position: Math.round(n.beatInMeasure * 12) / 12,
      verdict: score.results[i].verdict,
      offset_ms: score.results[i].offsetMs,
      key: scored.noteKeys?.[i].key ?? null,
      pair: scored.noteKeys?.[i].pair ?? null,
    }));
    if (rows.length > 0) {
      // One statement for every note: the rows travel as one JSON parameter.
      await tx.execute(sql`
        INSERT INTO take_notes (take_id, idx, player_id, midi, beat, measure, position, meter, verdict, offset_ms,
                                key, pattern, pair, instrument, played_at)
        SELECT ${args.id}, x.idx, ${args.playerId}, x.midi, x.beat, x.measure, x.position, ${meter}, x.verdict, x.offset_ms,
               COALESCE(x.key, ${scored.key}), ${scored.pattern}, COALESCE(x.pair, ${scored.pair}), ${drill.spec.instrument},
               ${args.startedAt.toISOString()}
        FROM jsonb_to_recordset(${JSON.stringify(rows)}::jsonb)
          AS x(idx int, midi int, beat real, measure int, position real, verdict text, offset_ms real, key text, pair text)`);
    }
    await climbTempo(
      tx,
      args.playerId,
      scored,
      !args.measures && (args.stoppedAtMs === undefined || args.stoppedAtMs === null),
    );
    return { take: inserted[0], created: true };
  });
}

function sameOwner(row: TakeRow, playerId: string) {
  if (row.playerId !== playerId) throw new AppError('conflict', 'A take with this id already exists; make a new id');
  return { take: row, created: false };
}
