import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { createUser, uniqueEmail } from '../helpers/factories';
import { createTestApp } from '../helpers/test-server';

// Behind a trusted proxy the client's address comes from X-Forwarded-For, so each test here
// has an IP of its own and the real per-IP limit (5) applies without meeting other files.
const ctx = createTestApp({ TRUST_PROXY: '1', SIGN_IN_IP_LIMIT: '5' });
afterAll(() => ctx.close());

// Documentation addresses (RFC 5737), one per test.
let nextIp = 1;
function uniqueIp() {
  return `198.51.100.${nextIp++}`;
}

async function clientFrom(ip: string) {
  const agent = request.agent(ctx.app);
  const res = await agent.get('/api/auth/csrf').set('X-Forwarded-For', ip);
  const token = res.body.token as string;
  return (body: object) =>
    agent.post('/api/auth/sign-in').set('X-Forwarded-For', ip).set('X-CSRF-Token', token).send(body);
}

describe('sign-in failures', () => {
  it('answers 429 after 5 failures for one address within a minute, even with the right password', async () => {
    const user = await createUser(ctx.db);
    const signIn = await clientFrom(uniqueIp());
    for (let i = 0; i < 5; i++)
      expect((await signIn({ email: user.email, password: `wrong-${i}-password` })).status).toBe(401);
    const sixth = await signIn({ email: user.email, password: 'wrong-again-password' });
    expect(sixth.status).toBe(429);
    expect(sixth.body.error.code).toBe('rate_limited');
    expect(sixth.body.error.message).toMatch(/minute/);
    expect((await signIn({ email: user.email, password: user.password })).status).toBe(429);
    // The same address from another IP is held too: the count is per address.
    const elsewhere = await clientFrom(uniqueIp());
    expect((await elsewhere({ email: user.email, password: user.password })).status).toBe(429);
  });

  it('answers 429 after 5 failures from one IP across addresses; other IPs are unaffected', async () => {
    const ip = uniqueIp();
    const signIn = await clientFrom(ip);
    for (let i = 0; i < 5; i++)
      expect((await signIn({ email: uniqueEmail('probe'), password: 'guess-guess-guess' })).status).toBe(401);
    const user = await createUser(ctx.db);
    expect((await signIn({ email: user.email, password: user.password })).status).toBe(429);
    const other = await clientFrom(uniqueIp());
    expect((await other({ email: user.email, password: user.password })).status).toBe(200);
  });

  it('lets the address in again once the minute has passed', async () => {
    const user = await createUser(ctx.db);
    const signIn = await clientFrom(uniqueIp());
    for (let i = 0; i < 5; i++) await signIn({ email: user.email, password: 'wrong-wrong-wrong' });
    expect((await signIn({ email: user.email, password: user.password })).status).toBe(429);
    // Age the failures past the window rather than waiting a minute.
    await ctx.pool.query("UPDATE sign_in_failures SET at = at - interval '61 seconds' WHERE email = $1", [user.email]);
    const later = await clientFrom(uniqueIp());
    expect((await later({ email: user.email, password: user.password })).status).toBe(200);
  });

  it('four failures then the right password signs in and clears the count', async () => {
    const user = await createUser(ctx.db);
    const signIn = await clientFrom(uniqueIp());
    for (let i = 0; i < 4; i++) await signIn({ email: user.email, password: 'wrong-wrong-wrong' });
    expect((await signIn({ email: user.email, password: user.password })).status).toBe(200);
    const { rows } = await ctx.pool.query('SELECT count(*)::int AS n FROM sign_in_failures WHERE email = $1', [
      user.email,
    ]);
    expect(rows[0].n).toBe(0);
  });
});
