import { sql } from 'drizzle-orm';
import { type DrillSpec, inAllKeys } from '../../../shared/engine';
import { KEYS } from '../../../shared/schemas/history';
import type { NextItem } from '../../../shared/schemas/maps';
import type { Db } from '../../db/client';
import { drillKey } from '../../../shared/practice/drill-identity';

/** Look-back for the weak cells, and the least notes a cell needs to count. */
export const NEXT_WINDOW_DAYS = 30;
export const NEXT_MIN_NOTES = 40;
const WEAK = 3;
const UNPRACTISED = 3;

type Cell = {
  key: string;
  pattern: string;
  notes: number;
  errors: number;
  days_since: number;
};

/**
 * What to practise next: the three weakest (key, pattern) cells over the last 30 days by error
 * rate, weighted up by days since the cell was last practised (rate x (1 + days / 30)), among
 * cells with at least 40 notes; then keys the player never played in a pattern they do play.
 * Days are UTC days, as the map summaries keep them.
 */
export async function whatNext(db: Db, playerId: string, now = new Date()): Promise<NextItem[]> {
  const today = now.toISOString().slice(0, 10);
  const { rows: recent } = await db.execute<Cell>(sql`
    WITH recent AS (
      SELECT s.key, s.pattern, sum(s.notes)::int AS notes, sum(s.errors)::int AS errors, max(s.day) AS last_day
      FROM map_key_days s
      WHERE s.player_id = ${playerId} AND s.notes > 0
        AND s.day > ${today}::date - ${NEXT_WINDOW_DAYS}::int AND s.day <= ${today}::date
      GROUP BY s.key, s.pattern HAVING sum(s.notes) >= ${NEXT_MIN_NOTES}
    )
    SELECT key, pattern, notes, errors, (${today}::date - last_day)::int AS days_since FROM recent`);
  const order = (k: string) => (KEYS as readonly string[]).indexOf(k);
  const weak = recent
    .map((c) => {
      const rate = c.errors / c.notes;
      return { ...c, rate, score: rate * (1 + c.days_since / NEXT_WINDOW_DAYS) };
    })
    .filter((c) => c.errors > 0)
    .sort(
      (a, b) =>
        b.score - a.score || b.notes - a.notes || order(a.key) - order(b.key) || a.pattern.localeCompare(b.pattern),
    )
    .slice(0, WEAK);

  // Patterns the player plays (latest first) and the keys each has ever been played in.
  const { rows: played } = await db.execute<{ pattern: string; keys: string[]; last_day: string }>(sql`
    SELECT s.pattern, array_agg(DISTINCT s.key) AS keys, max(s.day)::text AS last_day
    FROM map_key_days s WHERE s.player_id = ${playerId} AND s.notes > 0
    GROUP BY s.pattern ORDER BY max(s.day) DESC, s.pattern`);
  const unpractised: Array<{ key: string; pattern: string }> = [];
  for (const p of played) {
    for (const key of KEYS) {
      if (unpractised.length >= UNPRACTISED) break;
      if (!p.keys.includes(key)) unpractised.push({ key, pattern: p.pattern });
    }
  }

  const specs = await latestSpecs(db, playerId, [...new Set([...weak, ...unpractised].map((c) => c.pattern))]);
  const specFor = (key: string, pattern: string) => {
    const spec = specs.get(pattern);
    return spec ? moveToKey(spec, key) : null;
  };
  return [
    ...weak.map((c) => ({
      key: c.key,
      pattern: c.pattern,
      reason: 'weak' as const,
      notes: c.notes,
      errors: c.errors,
      rate: c.rate,
      daysSince: c.days_since,
      score: c.score,
      spec: specFor(c.key, c.pattern),
    })),
    ...unpractised.map((c) => ({
      ...c,
      reason: 'unpractised' as const,
      notes: 0,
      errors: 0,
      rate: null,
      daysSince: null,
      score: null,
      spec: specFor(c.key, c.pattern),
    })),
  ];
}

async function latestSpecs(db: Db, playerId: string, patterns: string[]): Promise<Map<string, DrillSpec>> {
  if (patterns.length === 0) return new Map();
  const { rows } = await db.execute<{ pattern: string; spec: DrillSpec }>(sql`
    SELECT DISTINCT ON (t.pattern) t.pattern, t.spec FROM takes t
    WHERE t.player_id = ${playerId} AND t.pattern IN (${sql.join(
      patterns.map((p) => sql`${p}`),
      sql`, `,
    )})
    ORDER BY t.pattern, t.started_at DESC`);
  return new Map(rows.map((r) => [r.pattern, r.spec]));
}

/** The spec moved so its first triad's root is `key` (the engine's key cycle does the moving). */
export function moveToKey(spec: DrillSpec, key: string): DrillSpec | null {
  try {
    const drill = inAllKeys(spec, 'chromatic').find((d) => drillKey(d.spec) === key);
    return drill ? drill.spec : null;
  } catch {
    return null;
  }
}
