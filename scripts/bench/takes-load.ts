/**
 * POST /api/takes with 500-note takes, sent open-loop (each at its planned time, whether or not
 * earlier ones have answered) at 20 per second for 30 s, to an app on 127.0.0.1 over the bench
 * database; then rising rates for 10 s each until p95 passes 100 ms, to find the highest rate
 * that keeps it under. Bounded: at most 200 per second and about two minutes; stops by itself.
 */
import { randomUUID } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import { createApp } from '../../server/app';
import { parseEnv } from '../../server/env';
import { longTake, longTakeSpecs } from '../seed-history';
import { prng } from '../../server/db/seed/history';
import { hashPassword } from '../../server/services/auth/password-hash';
import { users } from '../../server/db/schema';
import { BENCH_DB, benchDatabase } from './bench-db';
import { pct } from './maps';

const EMAIL = 'bench-load@sixfold.test';
const PASSWORD = 'bench-load-takes';

async function signIn(base: string): Promise<{ cookie: string; csrf: string }> {
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
    body: JSON.stringify({ email: EMAIL, password: PASSWORD }),
  });
  if (!res.ok) throw new Error(`bench sign-in failed: ${res.status}`);
  keep(res);
  const csrf2 = await fetch(`${base}/api/auth/csrf`, { headers: { cookie } });
  keep(csrf2);
  return { cookie, csrf: ((await csrf2.json()) as { token: string }).token };
}

/** Sends `rate` takes a second for `seconds`, open-loop; latencies from each planned send time. */
async function phase(
  base: string,
  auth: { cookie: string; csrf: string },
  bodies: string[],
  rate: number,
  seconds: number,
) {
  const total = rate * seconds;
  const latencies: number[] = [];
  let errors = 0;
  const start = performance.now() + 50;
  const sends: Promise<void>[] = [];
  for (let i = 0; i < total; i++) {
    const planned = start + (i * 1000) / rate;
    const wait = planned - performance.now();
    if (wait > 0) await new Promise((r) => setTimeout(r, wait));
    const body = bodies[i % bodies.length].replace('__ID__', randomUUID());
    sends.push(
      fetch(`${base}/api/takes`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', 'x-csrf-token': auth.csrf, cookie: auth.cookie },
        body,
      })
        .then(async (res) => {
          await res.arrayBuffer();
          if (res.status !== 201) errors++;
          latencies.push(performance.now() - planned);
        })
        .catch(() => {
          errors++;
        }),
    );
  }
  await Promise.all(sends);
  return { sent: total, errors, p50: pct(latencies, 50), p95: pct(latencies, 95), max: Math.max(...latencies) };
}

export async function run(): Promise<void> {
  const { db, pool, url } = await benchDatabase(10);
  const env = parseEnv({ ...process.env, NODE_ENV: 'test', DATABASE_URL: url, SIGN_IN_IP_LIMIT: '10000' });
  const app = createApp({ db, pool, env });
  const server = app.listen(0, '127.0.0.1');
  await new Promise<void>((resolve) => server.once('listening', () => resolve()));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  console.log(`database: ${BENCH_DB}; app on 127.0.0.1 only`);
  try {
    await db
      .insert(users)
      .values({ email: EMAIL, name: 'Bench Load', role: 'player', passwordHash: await hashPassword(PASSWORD) })
      .onConflictDoNothing({ target: users.email });
    const auth = await signIn(base);
    const rand = prng(20);
    const bodies = longTakeSpecs().map((spec) => {
      const take = longTake(spec, rand);
      return JSON.stringify({ id: '__ID__', spec, ...take, startedAt: new Date().toISOString() });
    });
    console.log(`takes of 500 expected notes, ${Math.round(bodies[0].length / 1024)} kB each`);
    await phase(base, auth, bodies, 5, 2); // warm-up
    const main = await phase(base, auth, bodies, 20, 30);
    console.log(
      `20/s for 30 s: ${main.sent} sent, ${main.errors} errors, p50 ${main.p50.toFixed(1)} ms, p95 ${main.p95.toFixed(1)} ms, max ${main.max.toFixed(0)} ms (goal p95 < 100 ms, no errors)`,
    );
    let best = main.p95 < 100 && main.errors === 0 ? 20 : 0;
    for (const rate of [30, 40, 50, 60, 80, 100, 130, 160, 200]) {
      const r = await phase(base, auth, bodies, rate, 10);
      console.log(`  ${rate}/s for 10 s: p50 ${r.p50.toFixed(1)} ms, p95 ${r.p95.toFixed(1)} ms, errors ${r.errors}`);
      if (r.p95 >= 100 || r.errors > 0) break;
      best = rate;
    }
    console.log(`highest rate tried with p95 < 100 ms: ${best}/s`);
  } finally {
    await new Promise<void>((resolve) => server.close(() => resolve()));
    await pool.end();
  }
}
