import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { type Client, createStudio, createUser, signedIn, uniqueEmail } from '../helpers/factories';
import { createTestApp } from '../helpers/test-server';

// Behind a trusted proxy the client's address comes from X-Forwarded-For, so each test here
// has addresses of its own and the real limits apply without meeting other files.
const ctx = createTestApp({
  TRUST_PROXY: '1',
  SIGN_IN_IP_LIMIT: '8',
  SIGN_UP_IP_LIMIT: '3',
  RESET_IP_LIMIT: '4',
  INVITE_LIMIT: '3',
});
afterAll(() => ctx.close());

// Documentation addresses (RFC 5737), a fresh one each time.
let nextIp = 1;
function uniqueIp() {
  return `198.51.100.${nextIp++}`;
}

async function clientFrom(ip: string) {
  const agent = request.agent(ctx.app);
  const res = await agent.get('/api/auth/csrf').set('X-Forwarded-For', ip);
  const token = res.body.token as string;
  return (body: object, path = '/api/auth/sign-in') =>
    agent.post(path).set('X-Forwarded-For', ip).set('X-CSRF-Token', token).send(body);
}

/** Moves an account's failures back in time, rather than waiting. */
async function age(email: string, seconds: number) {
  await ctx.pool.query(`UPDATE sign_in_failures SET at = at - make_interval(secs => $2) WHERE email = $1`, [
    email,
    seconds,
  ]);
}

describe('sign-in throttling: per account and source, slowing down, never locking the owner out', () => {
  it('5 failures from one source hold that source with a 429 and Retry-After, even with the right password', async () => {
    const user = await createUser(ctx.db);
    const signIn = await clientFrom(uniqueIp());
    for (let i = 0; i < 5; i++)
      expect((await signIn({ email: user.email, password: `wrong-${i}-password` })).status).toBe(401);
    const sixth = await signIn({ email: user.email, password: user.password });
    expect(sixth.status).toBe(429);
    expect(sixth.body.error.code).toBe('rate_limited');
    expect(Number(sixth.headers['retry-after'])).toBeGreaterThan(0);
    expect(Number(sixth.headers['retry-after'])).toBeLessThanOrEqual(60);
  });

  it('the right password from an address with no recent failures gets through', async () => {
    const user = await createUser(ctx.db);
    // The probe's attack: bad tries from five addresses, then the owner from a sixth.
    for (let i = 0; i < 5; i++) {
      const attacker = await clientFrom(uniqueIp());
      expect((await attacker({ email: user.email, password: 'guess-guess-guess' })).status).toBe(401);
    }
    const owner = await clientFrom(uniqueIp());
    expect((await owner({ email: user.email, password: user.password })).status).toBe(200);
  });

  it('a sustained attack from rotating addresses never blocks the owner', async () => {
    const user = await createUser(ctx.db);
    const attackers = await Promise.all(Array.from({ length: 6 }, () => clientFrom(uniqueIp())));
    const ownerIp = uniqueIp();
    let ownerIn = 0;
    for (let round = 0; round < 6; round++) {
      for (const a of attackers)
        expect([401, 429]).toContain((await a({ email: user.email, password: 'nope-nope-nope' })).status);
      // A new browser each time (a sign-in changes the session and its CSRF token).
      const owner = await clientFrom(ownerIp);
      if ((await owner({ email: user.email, password: user.password })).status === 200) ownerIn++;
    }
    expect(ownerIn).toBe(6);
    // The attackers were slowed: most of their later tries were held without a password check.
    const { rows } = await ctx.pool.query('SELECT count(*)::int AS n FROM sign_in_failures WHERE email = $1', [
      user.email,
    ]);
    expect(rows[0].n).toBeLessThan(36);
  });

  it('slows down rather than locks: the wait ends, and grows with each further failure', async () => {
    const user = await createUser(ctx.db);
    const signIn = await clientFrom(uniqueIp());
    for (let i = 0; i < 5; i++) await signIn({ email: user.email, password: 'wrong-wrong-wrong' });
    expect((await signIn({ email: user.email, password: 'wrong-wrong-wrong' })).status).toBe(429);
    await age(user.email, 61);
    // A sixth failure is allowed after the first wait; the next wait is longer (two minutes).
    expect((await signIn({ email: user.email, password: 'wrong-wrong-wrong' })).status).toBe(401);
    const held = await signIn({ email: user.email, password: user.password });
    expect(held.status).toBe(429);
    expect(Number(held.headers['retry-after'])).toBeGreaterThan(60);
    await age(user.email, 121);
    expect((await signIn({ email: user.email, password: user.password })).status).toBe(200);
  });

  it('one source failing across many accounts is slowed for all of them; other sources are not', async () => {
    const ip = uniqueIp();
    const signIn = await clientFrom(ip);
    for (let i = 0; i < 8; i++)
      expect((await signIn({ email: uniqueEmail('probe'), password: 'guess-guess-guess' })).status).toBe(401);
    const user = await createUser(ctx.db);
    expect((await signIn({ email: user.email, password: user.password })).status).toBe(429);
    const other = await clientFrom(uniqueIp());
    expect((await other({ email: user.email, password: user.password })).status).toBe(200);
  });

  it('four failures then the right password signs in and clears that source’s count', async () => {
    const user = await createUser(ctx.db);
    const ip = uniqueIp();
    const signIn = await clientFrom(ip);
    for (let i = 0; i < 4; i++) await signIn({ email: user.email, password: 'wrong-wrong-wrong' });
    expect((await signIn({ email: user.email, password: user.password })).status).toBe(200);
    const { rows } = await ctx.pool.query(
      'SELECT count(*)::int AS n FROM sign_in_failures WHERE email = $1 AND ip = $2',
      [user.email, ip],
    );
    expect(rows[0].n).toBe(0);
  });
});

describe('rate limits on reset, sign-up, invites; anonymous visitors make no session rows', () => {
  it('password reset: 3 mails an address in 15 minutes, then a 429 the same for known and unknown addresses', async () => {
    const user = await createUser(ctx.db);
    const stranger = uniqueEmail('nobody');
    const c = await clientFrom(uniqueIp());
    const c2 = await clientFrom(uniqueIp());
    for (let i = 0; i < 3; i++) {
      expect((await c({ email: user.email }, '/api/auth/password-reset')).status).toBe(200);
      expect((await c2({ email: stranger }, '/api/auth/password-reset')).status).toBe(200);
    }
    const known = await c({ email: user.email }, '/api/auth/password-reset');
    const unknown = await c2({ email: stranger }, '/api/auth/password-reset');
    expect(known.status).toBe(429);
    expect(unknown.status).toBe(429);
    expect(unknown.body.error.message).toBe(known.body.error.message);
    expect(Number(known.headers['retry-after'])).toBeGreaterThan(0);
  });

  it('password reset: one source may ask 4 times in 15 minutes (RESET_IP_LIMIT)', async () => {
    const c = await clientFrom(uniqueIp());
    for (let i = 0; i < 4; i++)
      expect((await c({ email: uniqueEmail('r') }, '/api/auth/password-reset')).status).toBe(200);
    expect((await c({ email: uniqueEmail('r') }, '/api/auth/password-reset')).status).toBe(429);
  });

  it('sign-up: 3 accounts from one source an hour (SIGN_UP_IP_LIMIT)', async () => {
    const ip = uniqueIp();
    const body = () => ({ email: uniqueEmail('new'), password: 'long-enough-pass', name: 'New', role: 'player' });
    for (let i = 0; i < 3; i++) {
      const c = await clientFrom(ip);
      expect((await c(body(), '/api/auth/sign-up')).status).toBe(201);
    }
    const c = await clientFrom(ip);
    const res = await c(body(), '/api/auth/sign-up');
    expect(res.status).toBe(429);
    expect(res.body.error.message).toMatch(/hour/);
  });

  it('invites: a teacher sends at most INVITE_LIMIT an hour', async () => {
    const teacher = await createUser(ctx.db, { role: 'teacher' });
    const studio = await createStudio(ctx.db, teacher.id);
    const t: Client = await signedIn(ctx.app, teacher);
    const ip = uniqueIp();
    const invite = () =>
      t.agent
        .post(`/api/studios/${studio.id}/invites`)
        .set('X-Forwarded-For', ip)
        .set('X-CSRF-Token', t.csrf)
        .send({ email: uniqueEmail('outside') });
    for (let i = 0; i < 3; i++) expect((await invite()).status).toBe(201);
    const fourth = await invite();
    expect(fourth.status).toBe(429);
    expect(fourth.body.error.code).toBe('rate_limited');
  });

  it('200 anonymous CSRF fetches create no session rows, and the token works for sign-in', async () => {
    const anonymousRows = async () =>
      (await ctx.pool.query("SELECT count(*)::int AS n FROM session WHERE sess->>'userId' IS NULL")).rows[0]
        .n as number;
    const before = await anonymousRows();
    for (let i = 0; i < 200; i++) {
      const res = await request(ctx.app).get('/api/auth/csrf').expect(200);
      const cookies = ([] as string[]).concat(res.headers['set-cookie'] ?? []);
      expect(cookies.some((c) => c.startsWith('sixfold.sid='))).toBe(false);
    }
    // (another file switching an account off may leave a row without a user meanwhile)
    expect((await anonymousRows()) - before).toBeLessThan(5);
    const user = await createUser(ctx.db);
    const c = await clientFrom(uniqueIp());
    expect((await c({ email: user.email, password: user.password })).status).toBe(200);
  });
});
