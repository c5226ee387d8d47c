/**
 * POST /api/takes with 500-note takes, sent open-loop (each at its planned time, whether or not
 * earlier ones have answered) by 50 signed-in players in turn, to the app in a process of its
 * own on 127.0.0.1 over the bench database. First where one take's time goes (takes-stages.ts);
 * then rising rates for 10 s each until p95 passes 100 ms; then 100 per second for 30 s, and the
 * same again with the engine bench running in a loop beside it (a busy machine). A run is cut
 * short when more than 1,000 takes wait at once. Bounded: about four minutes; stops by itself.
 */
import { type ChildProcess, fork, spawn } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { fileURLToPath } from 'node:url';
import { sql } from 'drizzle-orm';
import { users } from '../../server/db/schema';
import { prng } from '../../server/db/seed/history';
import { hashPassword } from '../../server/services/auth/password-hash';
import { longTake, longTakeSpecs } from '../seed-history';
import { BENCH_DB, benchDatabase } from './bench-db';
import { pct } from './maps';
import { processCpuMs, stageBreakdown } from './takes-stages';

const PLAYERS = 50;
const PASSWORD = 'bench-load-takes';
const email = (n: number) => `bench-load-${n}@sixfold.test`;
const MAX_WAITING = 1000;

interface Auth {
  cookie: string;
  csrf: string;
}

async function signIn(base: string, who: string): Promise<Auth> {
  let cookie = '';
  const keep = (res: Response) => {
    const set = res.headers.getSetCookie?.() ?? [];
    if (set.length > 0) cookie = set.map((c) => c.split(';')[0]).join('; ');
  };
  const csrf1 = await fetch(`${base}/api/auth/csrf`);
  keep(csrf1);
  const { token } = (await csrf1.json()) as { token: string };
  const res = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'x-csrf-token': token, cookie },
    body: JSON.stringify({ email: who, password: PASSWORD }),
  });
  if (!res.ok) throw new Error(`bench sign-in failed: ${res.status} ${await res.text()}`);
  keep(res);
  const csrf2 = await fetch(`${base}/api/auth/csrf`, { headers: { cookie } });
  keep(csrf2);
  return { cookie, csrf: ((await csrf2.json()) as { token: string }).token };
}

/** Sends `rate` takes a second for `seconds`, open-loop; latencies from each planned send time. */
async function phase(base: string, auths: Auth[], bodies: string[], rate: number, seconds: number, app: number) {
  const total = rate * seconds;
  const latencies: number[] = [];
  const errors = new Map<string, number>();
  const fail = (why: string) => errors.set(why, (errors.get(why) ?? 0) + 1);
  let waiting = 0;
  let cut = '';
  const cpu0 = processCpuMs(app);
  const start = performance.now() + 50;
  const sends: Promise<void>[] = [];
  for (let i = 0; i < total; i++) {
    const planned = start + (i * 1000) / rate;
    const wait = planned - performance.now();
    if (wait > 0) await new Promise((r) => setTimeout(r, wait));
    if (waiting > MAX_WAITING) {
      cut = `cut after ${((performance.now() - start) / 1000).toFixed(1)} s: ${waiting} takes waiting`;
      break;
    }
    const auth = auths[i % auths.length];
    const body = bodies[i % bodies.length].replace('__ID__', randomUUID());
    waiting++;
    sends.push(
      fetch(`${base}/api/takes`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', 'x-csrf-token': auth.csrf, cookie: auth.cookie },
        body,
      })
        .then(async (res) => {
          const text = await res.text();
          if (res.status !== 201) fail(`${res.status} ${text.slice(0, 120)}`);
          latencies.push(performance.now() - planned);
        })
        .catch((err: Error) => {
          fail(err.message);
        })
        .finally(() => {
          waiting--;
        }),
    );
  }
  await Promise.all(sends);
  const cpu1 = processCpuMs(app);
  const sent = sends.length;
  return {
    sent,
    errors: [...errors.values()].reduce((a, b) => a + b, 0),
    why: [...errors.entries()].map(([k, v]) => `${v} x ${k}`).join('; '),
    cut,
    p50: pct(latencies, 50),
    p95: pct(latencies, 95),
    p99: pct(latencies, 99),
    max: Math.max(...latencies),
    appCpu: cpu0 !== null && cpu1 !== null && sent > 0 ? (cpu1 - cpu0) / sent : null,
  };
}

type Result = Awaited<ReturnType<typeof phase>>;
const line = (label: string, r: Result) =>
  `${label}: ${r.sent} sent, ${r.errors} errors, p50 ${r.p50.toFixed(1)} ms, p95 ${r.p95.toFixed(1)} ms, p99 ${r.p99.toFixed(1)} ms, max ${r.max.toFixed(0)} ms` +
  (r.appCpu !== null ? `, app CPU ${r.appCpu.toFixed(1)} ms a take` : '') +
  (r.cut ? ` (${r.cut})` : '') +
  (r.why ? `\n    errors: ${r.why}` : '');

/** Runs the engine bench over and over in another process until stopped: a busy machine. */
function busyLoop(): { stop: () => void } {
  let stopped = false;
  let child: ChildProcess | null = null;
  const again = () => {
    if (stopped) return;
    child = spawn(
      process.execPath,
      ['--import', 'tsx', fileURLToPath(new URL('./index.ts', import.meta.url)), 'engine'],
      {
        stdio: 'ignore',
      },
    );
    child.on('exit', again);
  };
  again();
  return {
    stop: () => {
      stopped = true;
      child?.kill();
    },
  };
}

export async function run(): Promise<void> {
  const { db, pool, url } = await benchDatabase(4);
  const app = fork(fileURLToPath(new URL('./takes-app.ts', import.meta.url)), {
    execArgv: ['--import', 'tsx'],
    env: { ...process.env, BENCH_DATABASE_URL: url },
  });
  try {
    const port = await new Promise<number>((resolve, reject) => {
      app.once('message', (m: { port: number }) => resolve(m.port));
      app.once('exit', (code) => reject(new Error(`the bench app stopped (${code})`)));
    });
    const base = `http://127.0.0.1:${port}`;
    console.log(`database: ${BENCH_DB}; app in its own process on 127.0.0.1 only; ${PLAYERS} players`);
    const passwordHash = await hashPassword(PASSWORD);
    await db
      .insert(users)
      .values(
        Array.from({ length: PLAYERS }, (_, n) => ({
          email: email(n),
          name: `Bench Load ${n}`,
          role: 'player' as const,
          passwordHash,
        })),
      )
      .onConflictDoNothing({ target: users.email });
    const auths: Auth[] = [];
    for (let n = 0; n < PLAYERS; n++) auths.push(await signIn(base, email(n)));
    const rand = prng(20);
    const bodies = longTakeSpecs().map((spec) => {
      const take = longTake(spec, rand);
      return JSON.stringify({ id: '__ID__', spec, ...take, startedAt: new Date().toISOString() });
    });
    console.log(`takes of 500 expected notes, ${Math.round(bodies[0].length / 1024)} kB each`);

    const { rows } = await db.execute<{ id: string }>(sql`SELECT id FROM users WHERE email = ${email(0)}`);
    await stageBreakdown(pool, rows[0].id, bodies);

    await phase(base, auths, bodies, 10, 2, app.pid ?? 0); // warm-up
    let best = 0;
    for (const rate of [20, 40, 60, 80, 100, 130, 160, 200]) {
      const r = await phase(base, auths, bodies, rate, 10, app.pid ?? 0);
      console.log(`  ${line(`${rate}/s for 10 s`, r)}`);
      if (r.p95 >= 100 || r.errors > 0) break;
      best = rate;
    }
    console.log(`highest rate with p95 < 100 ms (10 s each): ${best === 0 ? 'none of 20/s and up' : `${best}/s`}`);
    const main = await phase(base, auths, bodies, 100, 30, app.pid ?? 0);
    console.log(line('100/s for 30 s', main), '(goal p95 < 100 ms, no errors)');
    const busy = busyLoop();
    try {
      const loaded = await phase(base, auths, bodies, 100, 30, app.pid ?? 0);
      console.log(line('100/s for 30 s, engine bench looping beside it', loaded), '(goal p99 < 500 ms, no errors)');
    } finally {
      busy.stop();
    }
  } finally {
    app.disconnect();
    await pool.end();
  }
}
