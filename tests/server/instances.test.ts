import { readFileSync } from 'node:fs';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDb } from '../../server/db/client';
import { runMigrations } from '../../server/db/migrate';
import type { DrillSpec } from '../../shared/schemas/drills';
import { type Client, client, createUser, signedIn, waitForMail } from '../helpers/factories';
import { buildServer, emptyDatabase, type Instance, runToExit, startInstance } from '../helpers/instances';

// Several real server processes, from the build `npm run build` makes (plain Node, no tsx):
// two installations side by side on one machine, and two instances behind one database.

const journal = JSON.parse(readFileSync(new URL('../../drizzle/meta/_journal.json', import.meta.url), 'utf8')) as {
  entries: unknown[];
};
let build: ReturnType<typeof buildServer>;
const cleanup: Array<() => Promise<void> | void> = [];

beforeAll(() => {
  build = buildServer();
  cleanup.push(() => build.remove());
});
afterAll(async () => {
  for (const fn of cleanup.reverse()) await fn();
});

/** The supertest agent against a running instance, typed as the app-based helpers expect. */
const app = (instance: Instance) => instance.url as never;

async function migrationCount(url: string): Promise<number> {
  const { pool } = createDb(url, 1);
  try {
    const { rows } = await pool.query('SELECT count(*)::int AS n FROM drizzle.__drizzle_migrations');
    return rows[0].n;
  } finally {
    await pool.end();
  }
}

describe('migrations under an advisory lock', () => {
  it('two migrators at once on one empty database apply each migration once', async () => {
    const empty = await emptyDatabase('sixfold_lock');
    cleanup.push(() => empty.drop());
    const a = createDb(empty.url, 2);
    const b = createDb(empty.url, 2);
    await Promise.all([runMigrations(a.db), runMigrations(b.db)]);
    await Promise.all([a.pool.end(), b.pool.end()]);
    expect(await migrationCount(empty.url)).toBe(journal.entries.length);
  });
});

describe('the production build', () => {
  it('refuses to start without its required settings, naming each', async () => {
    const { code, output } = await runToExit(build.entry, { NODE_ENV: 'production' });
    expect(code).toBe(1);
    for (const name of [
      'DATABASE_URL',
      'SESSION_SECRET',
      'PUBLIC_URL',
      'SMTP_HOST',
      'STRIPE_SECRET_KEY',
      'STRIPE_WEBHOOK_SECRET',
    ])
      expect(output).toContain(name);
  });

  it('two instances started at once on one empty database: one migration each, shared sessions, no secrets logged', async () => {
    const empty = await emptyDatabase('sixfold_many');
    cleanup.push(() => empty.drop());
    const env = {
      NODE_ENV: 'production',
      DATABASE_URL: empty.url,
      SESSION_SECRET: 'one-secret-for-every-instance',
      PUBLIC_URL: 'https://sixfold.example',
      SMTP_HOST: '127.0.0.1',
      SMTP_PORT: '9',
      STRIPE_SECRET_KEY: 'sk_test_instances',
      STRIPE_WEBHOOK_SECRET: 'whsec_instances',
      // Plain HTTP on loopback in this test; a real deployment keeps the default (Secure).
      COOKIE_SECURE: '0',
    };
    const [a, b] = await Promise.all([startInstance(build.entry, env), startInstance(build.entry, env)]);
    cleanup.push(
      () => a.stop(),
      () => b.stop(),
    );
    expect(await migrationCount(empty.url)).toBe(journal.entries.length);
    for (const i of [a, b]) expect((await request(i.url).get('/api/health')).body).toEqual({ ok: true, db: 'up' });

    // Headers of a production answer.
    const health = await request(a.url).get('/api/health');
    expect(health.headers['content-security-policy']).toContain("frame-ancestors 'none'");
    expect(health.headers['strict-transport-security']).toMatch(/max-age=\d+/);
    expect(health.headers['x-content-type-options']).toBe('nosniff');
    expect(health.headers['referrer-policy']).toBe('strict-origin-when-cross-origin');

    // Signed in on one instance, the session works on the other (sessions live in PostgreSQL).
    const { db, pool } = createDb(empty.url, 1);
    cleanup.push(() => pool.end());
    const user = await createUser(db, { password: 'correct-horse-battery' });
    const onA: Client = await signedIn(app(a), user);
    const sid = onA.agent.jar.getCookie('sixfold.sid', {
      domain: '127.0.0.1',
      path: '/',
      secure: false,
      script: false,
    });
    expect(sid).toBeTruthy();
    const onB = await request(b.url).get('/api/auth/me').set('Cookie', `sixfold.sid=${sid!.value}`);
    expect(onB.status).toBe(200);
    expect(onB.body.user.email).toBe(user.email);
    // A token a signed-out visitor got from one instance is good on the other.
    const anonA = await request(a.url).get('/api/auth/csrf');
    const anonCookie = ([] as string[])
      .concat(anonA.headers['set-cookie'] ?? [])
      .find((c) => c.startsWith('sixfold.csrf='));
    const signInOnB = await request(b.url)
      .post('/api/auth/sign-in')
      .set('Cookie', anonCookie!.split(';')[0])
      .set('X-CSRF-Token', anonA.body.token)
      .send({ email: user.email, password: user.password });
    expect(signInOnB.status).toBe(200);

    // The request log has a line per request and none of the secrets that passed through.
    const log = a.output();
    expect(log).toMatch(/"path":"\/api\/auth\/sign-in"/);
    for (const secret of [user.password, sid!.value, anonA.body.token, onA.csrf]) expect(log).not.toContain(secret);
  });
});

describe('two installations on one machine (development, each with fakes of its own)', () => {
  const DC: DrillSpec = { pair: ['D', 'C'], pattern: 'four-three', direction: 'up', tempo: 100, chord: 'D7' };

  async function install(instance: Instance, url: string) {
    const { db, pool } = createDb(url, 2);
    cleanup.push(() => pool.end());
    const admin = await signedIn(app(instance), await createUser(db, { role: 'admin' }));
    const teacher = await signedIn(app(instance), await createUser(db, { role: 'teacher' }));
    const playerUser = await createUser(db, { role: 'player' });
    const player = await signedIn(app(instance), playerUser);
    const book = await teacher.post('/api/books', { title: 'Pairs', priceMinor: 900, currency: 'EUR' }).expect(201);
    const bookId = book.body.book.id as string;
    for (const name of ['Free', 'Paid']) {
      const saved = await teacher.post('/api/drills', { name, spec: DC, keyOrder: 'chromatic' }).expect(201);
      await teacher.post(`/api/books/${bookId}/drills`, { savedDrillId: saved.body.drill.id }).expect(201);
    }
    const published = await teacher.patch(`/api/books/${bookId}`, { published: true }).expect(200);
    return { db, admin, player, playerUser, bookId, lockedId: published.body.book.drills[1].id as string };
  }

  it('mail and purchases of each stay its own', async () => {
    const [dbA, dbB] = await Promise.all([emptyDatabase('sixfold_home_a'), emptyDatabase('sixfold_home_b')]);
    cleanup.push(
      () => dbA.drop(),
      () => dbB.drop(),
    );
    const dev = { NODE_ENV: 'development', LOG_LEVEL: 'silent' };
    const [a, b] = await Promise.all([
      startInstance(build.entry, { ...dev, DATABASE_URL: dbA.url }),
      startInstance(build.entry, { ...dev, DATABASE_URL: dbB.url }),
    ]);
    cleanup.push(
      () => a.stop(),
      () => b.stop(),
    );
    const homeA = await install(a, dbA.url);
    const homeB = await install(b, dbB.url);

    // A reset requested on each lands in its own outbox and only there.
    for (const [instance, home] of [
      [a, homeA],
      [b, homeB],
    ] as const) {
      const anon = await client(app(instance));
      await anon.post('/api/auth/password-reset', { email: home.playerUser.email }).expect(200);
      const [mail] = await waitForMail(home.admin, home.playerUser.email);
      // The link points at this installation's own address.
      expect(mail.text).toContain(`${instance.url}/reset-password?token=`);
    }
    for (const [home, other] of [
      [homeA, homeB],
      [homeB, homeA],
    ] as const) {
      const res = await home.admin.get(`/api/dev/outbox?to=${encodeURIComponent(other.playerUser.email)}`).expect(200);
      expect(res.body.messages).toEqual([]);
    }

    // Each checkout goes to the installation's own fake, and its webhook back to the same server.
    const origins: string[] = [];
    for (const home of [homeA, homeB]) {
      const res = await home.player.post(`/api/books/${home.bookId}/checkout`).expect(200);
      const url = new URL(res.body.url);
      origins.push(url.origin);
      const paid = await fetch(`${url.origin}/pay/${url.pathname.split('/').pop()}/complete`, {
        method: 'POST',
        redirect: 'manual',
      });
      expect(paid.status).toBe(303);
      expect((await home.player.get(`/api/books/${home.bookId}/drills/${home.lockedId}`)).status).toBe(200);
    }
    expect(origins[0]).not.toBe(origins[1]);
  });
});
