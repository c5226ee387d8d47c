/**
 * Where a saved take's time goes, stage by stage, measured by calling the write path's own
 * pieces one take at a time: parse (JSON and the request schema), score (the engine), then the
 * take's one statement under EXPLAIN ANALYZE inside a transaction, whose plan splits the
 * database's part into the takes row, the notes, their foreign-key checks, the map summaries
 * (statement triggers) and the tempo climb; then the commit (its WAL flush). EXPLAIN's timing
 * adds a little to each database stage. Also CPU per take: the app's stages in this process
 * and the database backend's (from /proc), which a busy machine disturbs far less than wall time.
 */
import { readFileSync } from 'node:fs';
import { randomUUID } from 'node:crypto';
import { PgDialect } from 'drizzle-orm/pg-core';
import type pg from 'pg';
import { takeStatement } from '../../server/services/takes/create';
import { scoreRawTake } from '../../server/services/takes/score-take';
import { CreateTakeInput } from '../../shared/schemas/takes';
import { pct } from './maps';

interface PlanNode {
  'Node Type': string;
  'Subplan Name'?: string;
  'Actual Total Time'?: number;
  Plans?: PlanNode[];
}
interface Explained {
  Plan: PlanNode;
  Triggers?: { 'Trigger Name': string; 'Constraint Name'?: string; Relation: string; Time: number; Calls: number }[];
  'Planning Time': number;
  'Execution Time': number;
}

const dialect = new PgDialect();

const STAGES = [
  'parse',
  'score',
  'takes row',
  'notes',
  'notes FK checks',
  'map summaries',
  'tempo climb',
  'round trip',
  'commit',
] as const;
type Stage = (typeof STAGES)[number];

/** CPU seconds (user + system) of a process on this machine, from /proc/<pid>/stat. */
export function processCpuMs(pid: number): number | null {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    // utime and stime are fields 14 and 15 (1-based) in clock ticks, 100 a second on Linux.
    return ((Number(fields[11]) + Number(fields[12])) * 1000) / 100;
  } catch {
    return null;
  }
}

function cteTime(plan: PlanNode, name: string): number {
  const found = (plan.Plans ?? []).find((p) => p['Subplan Name'] === `CTE ${name}`);
  return found?.['Actual Total Time'] ?? 0;
}

export async function stageBreakdown(pool: pg.Pool, playerId: string, bodies: string[], count = 60) {
  const times: Record<Stage, number[]> = Object.fromEntries(STAGES.map((s) => [s, []])) as never;
  const client = await pool.connect();
  let appCpu = 0;
  let dbCpu: number | null = null;
  try {
    const { rows } = await client.query<{ pid: number }>('SELECT pg_backend_pid() AS pid');
    const backend = rows[0].pid;
    const cpu0 = processCpuMs(backend);
    for (let i = 0; i < count; i++) {
      const body = bodies[i % bodies.length].replace('__ID__', randomUUID());
      const c0 = process.cpuUsage();
      let t = performance.now();
      const input = CreateTakeInput.parse(JSON.parse(body));
      times.parse.push(performance.now() - t);
      t = performance.now();
      const args = {
        ...input,
        playerId,
        startedAt: new Date(input.startedAt),
        measures: input.measures ?? null,
      };
      const scored = scoreRawTake(args);
      times.score.push(performance.now() - t);
      const query = dialect.sqlToQuery(takeStatement(args, scored));
      const c1 = process.cpuUsage(c0);
      appCpu += (c1.user + c1.system) / 1000;
      await client.query('BEGIN');
      t = performance.now();
      const res = await client.query(`EXPLAIN (ANALYZE, FORMAT JSON) ${query.sql}`, query.params as unknown[]);
      const wall = performance.now() - t;
      const plan = (res.rows[0]['QUERY PLAN'] as Explained[])[0];
      t = performance.now();
      await client.query('COMMIT');
      times.commit.push(performance.now() - t);
      const triggers = plan.Triggers ?? [];
      // A foreign key's check is listed under its constraint's name, a trigger of ours under its own.
      const trig = (pick: (name: string) => boolean) =>
        triggers.filter((tr) => pick(tr['Constraint Name'] ?? tr['Trigger Name'])).reduce((s, tr) => s + tr.Time, 0);
      times['takes row'].push(cteTime(plan.Plan, 't') + trig((n) => n.includes('takes_player_id')));
      times.notes.push(cteTime(plan.Plan, 'notes'));
      times['notes FK checks'].push(trig((n) => n.includes('take_notes_take_id')));
      times['map summaries'].push(trig((n) => n.startsWith('take_notes_add_to')));
      times['tempo climb'].push(cteTime(plan.Plan, 'climb'));
      times['round trip'].push(Math.max(0, wall - plan['Execution Time'] - plan['Planning Time']));
    }
    const cpu1 = processCpuMs(backend);
    if (cpu0 !== null && cpu1 !== null) dbCpu = (cpu1 - cpu0) / count;
  } finally {
    client.release();
  }
  console.log(`where the time goes, ${count} takes one at a time (median / p95 ms):`);
  for (const s of STAGES) {
    if (times[s].every((x) => x === 0)) continue;
    console.log(`  ${s.padEnd(16)} ${pct(times[s], 50).toFixed(2).padStart(6)} / ${pct(times[s], 95).toFixed(2)}`);
  }
  console.log(
    `  CPU per take: app stages ${(appCpu / count).toFixed(2)} ms, database backend ${dbCpu === null ? 'n/a' : `${dbCpu.toFixed(1)} ms`}`,
  );
}
