import { createHash } from 'node:crypto';
import { type SQL, sql } from 'drizzle-orm';
import { PgDialect } from 'drizzle-orm/pg-core';
import type { DrillSpec, PlayedNote, ScoreOptions } from '../../../shared/engine';
import type { InputKind } from '../../../shared/schemas/takes';
import type { Db } from '../../db/client';
import type { TakeRow } from '../../db/schema/takes';
import { AppError } from '../../errors';
import { tempoClimbStep } from '../practice/climb-tempo';
import { takeDurationMs } from './duration';
import { type ScoredTake, scoreRawTake } from './score-take';

const dialect = new PgDialect();

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
 * Scores and stores a take with its per-note results. The client's id makes it idempotent: the
 * same id again returns the stored take (created: false), never a copy.
 *
 * The take, its notes (whose statement triggers add them to the map summaries) and the tempo
 * climb go in one statement, so a take costs the database one round trip and one commit.
 */
export async function createTake(db: Db, args: CreateTakeArgs): Promise<{ take: TakeRow; created: boolean }> {
  const scored = scoreRawTake(args);
  const statement = takeStatement(args, scored);
  const query = dialect.sqlToQuery(statement);
  // A named statement: each connection parses and plans each of its few shapes once.
  const { rows } = await db.$client.query<StoredFigures>({
    name: `take-${createHash('sha1').update(query.sql).digest('hex').slice(0, 16)}`,
    text: query.sql,
    values: query.params,
  });
  if (rows.length === 0) {
    // The id was taken (a retry, or another request with the same id): answer with what is stored.
    const row = await db.query.takes.findFirst({ where: (t, { eq }) => eq(t.id, args.id) });
    if (!row) throw new AppError('conflict', 'The take could not be stored; send it again');
    return sameOwner(row, args.playerId);
  }
  return { take: storedRow(args, scored, rows[0]), created: true };
}

/** What the database decides or rounds (float4 columns), read back from the statement. */
interface StoredFigures extends Record<string, unknown> {
  created_at: Date | string;
  tempo: number;
  accuracy: number;
  mean_offset_ms: number | null;
  stopped_at_ms: number | null;
  duration_ms: number | null;
}

/**
 * The one statement that stores a scored take: the takes row (nothing when the id exists), then,
 * only when that row went in, the tempo climb's step and every note's result. Answers one row
 * with the stored figures, or none when the id was already there.
 */
export function takeStatement(args: CreateTakeArgs, scored: ScoredTake): SQL {
  const v = takeRowValues(args, scored);
  const climb = tempoClimbStep(args.playerId, scored, wholeTake(args));
  const notes = takeNotesArrays(scored);
  return sql`
    WITH t AS (
      INSERT INTO takes (id, player_id, assignment_id, spec, options, measure_from, measure_to, stopped_at_ms,
                         input_kind, played, score, key, pattern, pair, instrument, tempo, accuracy, mean_offset_ms,
                         note_count, duration_ms, started_at)
      VALUES (${v.id}, ${v.playerId}, ${v.assignmentId}, ${JSON.stringify(v.spec)}, ${JSON.stringify(v.options)},
              ${v.measureFrom}, ${v.measureTo}, ${v.stoppedAtMs}, ${v.inputKind}, ${JSON.stringify(v.played)},
              ${JSON.stringify(v.score)}, ${v.key}, ${v.pattern}, ${v.pair}, ${v.instrument}, ${v.tempo},
              ${v.accuracy}, ${v.meanOffsetMs}, ${v.noteCount}, ${v.durationMs}, ${v.startedAt.toISOString()})
      ON CONFLICT (id) DO NOTHING
      RETURNING created_at, tempo, accuracy, mean_offset_ms, stopped_at_ms, duration_ms
    )${
      climb
        ? sql`, climb AS (
      INSERT INTO tempo_climbs (player_id, drill, key, tempo, last_tempo, last_verdict)
      SELECT ${climb.playerId}, ${climb.drill}, ${climb.key}, ${climb.tempo}, ${climb.lastTempo}, ${climb.lastVerdict}
      FROM t
      ON CONFLICT (player_id, drill, key) DO UPDATE
      SET tempo = EXCLUDED.tempo, last_tempo = EXCLUDED.last_tempo, last_verdict = EXCLUDED.last_verdict,
          updated_at = now()
    )`
        : sql``
    }${
      notes
        ? sql`, notes AS (
      INSERT INTO take_notes (take_id, idx, player_id, midi, beat, measure, position, meter, verdict, offset_ms,
                              key, pattern, pair, instrument, played_at)
      SELECT ${args.id}, x.n - 1, ${args.playerId}, x.midi, x.beat, x.measure, x.position, ${notes.meter}, x.verdict,
             x.offset_ms, COALESCE(x.key, ${scored.key}), ${scored.pattern}, COALESCE(x.pair, ${scored.pair}),
             ${v.instrument}, ${v.startedAt.toISOString()}
      FROM unnest(${notes.midi}::int[], ${notes.beat}::real[], ${notes.measure}::int[], ${notes.position}::real[],
                  ${notes.verdict}::text[], ${notes.offsetMs}::real[], ${notes.key}::text[], ${notes.pair}::text[])
        WITH ORDINALITY AS x(midi, beat, measure, position, verdict, offset_ms, key, pair, n)
      WHERE EXISTS (SELECT FROM t)
    )`
        : sql``
    }
    SELECT * FROM t`;
}

/** The stored row, from what was sent and the figures the database gave back. */
function storedRow(args: CreateTakeArgs, scored: ScoredTake, got: StoredFigures): TakeRow {
  return {
    ...takeRowValues(args, scored),
    tempo: got.tempo,
    accuracy: got.accuracy,
    meanOffsetMs: got.mean_offset_ms,
    stoppedAtMs: got.stopped_at_ms,
    durationMs: got.duration_ms,
    createdAt: new Date(got.created_at),
  };
}

/** A whole take (no passage, not stopped early) moves the tempo climb. */
export function wholeTake(args: CreateTakeArgs): boolean {
  return !args.measures && (args.stoppedAtMs === undefined || args.stoppedAtMs === null);
}

/** The takes row of a scored take. */
export function takeRowValues(args: CreateTakeArgs, scored: ScoredTake) {
  const { drill, score } = scored;
  return {
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
    durationMs: takeDurationMs(scored.expected, args.played, scored.options.tempo, args.stoppedAtMs),
    startedAt: args.startedAt,
  };
}

/** A PostgreSQL array literal of numbers (null as NULL). */
const numbers = (xs: (number | null)[]) => `{${xs.map((x) => (x === null ? 'NULL' : String(x))).join(',')}}`;
/** A PostgreSQL array literal of strings, each quoted. */
const texts = (xs: string[]) => `{${xs.map((x) => `"${x.replace(/["\\]/g, '\\$&')}"`).join(',')}}`;

/**
 * Every scored note's result as one array parameter per column (compact to send, cheap to
 * unnest); null when no note was scored. Chords' keys and pairs only over a progression.
 */
function takeNotesArrays(scored: ScoredTake) {
  const { drill, score, expected } = scored;
  if (expected.length === 0) return null;
  return {
    meter: `${drill.spec.meter[0]}/${drill.spec.meter[1]}`,
    midi: numbers(expected.map((n) => n.midi)),
    beat: numbers(expected.map((n) => n.beat)),
    measure: numbers(expected.map((n) => n.measure)),
    position: numbers(expected.map((n) => Math.round(n.beatInMeasure * 12) / 12)),
    verdict: texts(score.results.map((r) => r.verdict)),
    offsetMs: numbers(score.results.map((r) => r.offsetMs)),
    key: scored.noteKeys ? texts(scored.noteKeys.map((k) => k.key)) : null,
    pair: scored.noteKeys ? texts(scored.noteKeys.map((k) => k.pair)) : null,
  };
}

function sameOwner(row: TakeRow, playerId: string) {
  if (row.playerId !== playerId) throw new AppError('conflict', 'A take with this id already exists; make a new id');
  return { take: row, created: false };
}
