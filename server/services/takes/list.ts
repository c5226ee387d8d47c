import { sql } from 'drizzle-orm';
import type { ListTakesQuery, ListTakesResponse, TakeSummary } from '../../../shared/schemas/history';
import type { Db } from '../../db/client';
import { takeWhere } from '../maps/take-where';

const SORT_SQL = {
  startedAt: sql`t.started_at`,
  accuracy: sql`t.accuracy`,
  tempo: sql`t.tempo`,
  // C Db D ... B, not alphabetical
  key: sql`array_position(ARRAY['C','Db','D','Eb','E','F','F#','G','Ab','A','Bb','B'], t.key)`,
} as const;

type Row = {
  id: string;
  player_id: string;
  started_at: Date | string;
  pair: string;
  pattern: string;
  key: string;
  instrument: string;
  tempo: number;
  accuracy: number;
  mean_offset_ms: number | null;
  note_count: number;
  duration_ms: number | null;
  measure_from: number | null;
  measure_to: number | null;
  stopped_at_ms: number | null;
};

/** One page of a player's takes, sorted and filtered in SQL, with the total that matched. */
export async function listTakes(db: Db, playerId: string, q: ListTakesQuery): Promise<ListTakesResponse> {
  const where = takeWhere(playerId, q);
  const dir = q.dir === 'asc' ? sql`ASC` : sql`DESC`;
  const [{ rows }, { rows: count }] = await Promise.all([
    db.execute<Row>(sql`
      SELECT t.id, t.player_id, t.started_at, t.pair, t.pattern, t.key, t.instrument, t.tempo, t.accuracy,
             t.mean_offset_ms, t.note_count, t.duration_ms, t.measure_from, t.measure_to, t.stopped_at_ms
      FROM takes t WHERE ${where}
      ORDER BY ${SORT_SQL[q.sort]} ${dir}, t.started_at DESC, t.id
      LIMIT ${q.pageSize} OFFSET ${(q.page - 1) * q.pageSize}`),
    db.execute<{ total: number }>(sql`SELECT count(*)::int AS total FROM takes t WHERE ${where}`),
  ]);
  return { takes: rows.map(presentSummary), total: count[0]?.total ?? 0, page: q.page, pageSize: q.pageSize };
}

function presentSummary(r: Row): TakeSummary {
  return {
    id: r.id,
    playerId: r.player_id,
    startedAt: new Date(r.started_at).toISOString(),
    pair: r.pair,
    pattern: r.pattern,
    key: r.key,
    instrument: r.instrument,
    tempo: r.tempo,
    accuracy: r.accuracy,
    meanOffsetMs: r.mean_offset_ms,
    noteCount: r.note_count,
    durationMs: r.duration_ms,
    measures: r.measure_from !== null && r.measure_to !== null ? [r.measure_from, r.measure_to] : null,
    stopped: r.stopped_at_ms !== null,
  };
}
