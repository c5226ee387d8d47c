/**
 * Map queries over a 1,000,000-note history (bench database): p50 and p95 of 50 calls each.
 */
import type { MapQuery } from '../../shared/schemas/maps';
import { beatMap } from '../../server/services/maps/beat-map';
import { keyMap } from '../../server/services/maps/key-map';
import { rangeMap } from '../../server/services/maps/range-map';
import { whatNext } from '../../server/services/maps/what-next';
import { seedLongHistory } from '../seed-history';
import { BENCH_DB, benchDatabase } from './bench-db';

export const pct = (xs: number[], p: number) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.ceil((p / 100) * s.length) - 1)];
};

export async function run(): Promise<void> {
  const { db, pool } = await benchDatabase(4);
  console.log(`database: ${BENCH_DB} (its own; the demo database is untouched)`);
  try {
    const playerId = await seedLongHistory(db, 1_000_000);
    const recent: MapQuery = { from: new Date(Date.now() - 90 * 86_400_000).toISOString().slice(0, 10) };
    const cases: Array<[string, () => Promise<unknown>]> = [
      ['key map, all time', () => keyMap(db, playerId, {})],
      ['range map, all time', () => rangeMap(db, playerId, {})],
      ['beat map, all time', () => beatMap(db, playerId, {})],
      ['key map, last 90 days + pattern', () => keyMap(db, playerId, { ...recent, pattern: 'scale-steps' })],
      ['range map, last 90 days', () => rangeMap(db, playerId, recent)],
      ['what next', () => whatNext(db, playerId)],
    ];
    for (const [name, call] of cases) {
      await call();
      const times: number[] = [];
      for (let i = 0; i < 50; i++) {
        const t = performance.now();
        await call();
        times.push(performance.now() - t);
      }
      console.log(
        `${name.padEnd(34)} p50 ${pct(times, 50).toFixed(1)} ms  p95 ${pct(times, 95).toFixed(1)} ms  (goal p95 < 100 ms)`,
      );
    }
  } finally {
    await pool.end();
  }
}
