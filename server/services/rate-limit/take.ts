import { sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { rateLimits } from '../../db/schema';
import { rateLimited } from '../../errors';

export interface Limit {
  /** what is counted and for whom, e.g. `reset-ip:198.51.100.7` */
  key: string;
  /** requests allowed in one window */
  max: number;
  windowSeconds: number;
  /** the 429's message; "try again in N minutes" is added */
  message: string;
}

function wait(seconds: number): string {
  if (seconds < 90) return `${Math.max(1, Math.ceil(seconds))} seconds`;
  return `${Math.ceil(seconds / 60)} minutes`;
}

/**
 * Counts one request against a limit, in one statement that every instance shares; past the
 * limit it throws a 429 with Retry-After (the end of the current window).
 */
export async function takeLimit(db: Db, limit: Limit): Promise<void> {
  const w = limit.windowSeconds;
  const { rows } = await db.execute<{ hits: number; retry: number }>(sql`
    INSERT INTO ${rateLimits} (key, window_start, hits)
    VALUES (${limit.key}, to_timestamp(floor(extract(epoch FROM now()) / ${w}) * ${w}), 1)
    ON CONFLICT (key) DO UPDATE SET
      hits = CASE WHEN ${rateLimits.windowStart} = excluded.window_start THEN ${rateLimits.hits} + 1 ELSE 1 END,
      window_start = excluded.window_start
    RETURNING hits, extract(epoch FROM (window_start + make_interval(secs => ${w}) - now()))::float8 AS retry`);
  // Old windows count for nothing; now and then clear them out.
  if (Math.random() < 0.02) {
    await db.execute(sql`DELETE FROM ${rateLimits} WHERE window_start < now() - interval '1 day'`);
  }
  const row = rows[0];
  if (row && row.hits > limit.max) {
    throw rateLimited(`${limit.message}; try again in ${wait(row.retry)}`, row.retry);
  }
}
