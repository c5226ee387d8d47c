import { randomUUID } from 'node:crypto';
import type { Express } from 'express';
import request from 'supertest';
import type TestAgent from 'supertest/lib/agent';
import type { Role } from '../../shared/schemas/auth';
import type { OutboxMessage } from '../../shared/schemas/dev';
import type { Db } from '../../server/db/client';
import { studioMembers, studios, users } from '../../server/db/schema';
import { hashPassword } from '../../server/services/auth/password-hash';

export const TEST_PASSWORD = 'tuesday-combo-7';

/** An address no other test uses, so files running side by side never meet. */
export function uniqueEmail(prefix = 'user'): string {
  return `${prefix}-${randomUUID().slice(0, 12)}@test.sixfold.test`;
}

export interface TestUser {
  id: string;
  email: string;
  name: string;
  role: Role;
  password: string;
}

export async function createUser(
  db: Db,
  opts: { role?: Role; email?: string; name?: string; password?: string; disabled?: boolean } = {},
): Promise<TestUser> {
  const role = opts.role ?? 'player';
  const email = opts.email ?? uniqueEmail(role);
  const password = opts.password ?? TEST_PASSWORD;
  const name = opts.name ?? `Test ${role}`;
  const [row] = await db
    .insert(users)
    .values({ email, name, role, passwordHash: await hashPassword(password), disabled: opts.disabled ?? false })
    .returning();
  return { id: row.id, email, name, role, password };
}

export async function createStudio(db: Db, teacherId: string, playerIds: string[] = [], name = 'Test studio') {
  const [studio] = await db.insert(studios).values({ name, teacherId }).returning();
  for (const playerId of playerIds) await db.insert(studioMembers).values({ studioId: studio.id, playerId });
  return studio;
}

/** A cookie-keeping client that sends the session's CSRF token on every state-changing call. */
export interface Client {
  agent: TestAgent;
  csrf: string;
  refreshCsrf(): Promise<string>;
  post(path: string, body?: object): request.Test;
  patch(path: string, body?: object): request.Test;
  get(path: string): request.Test;
}

export async function client(app: Express): Promise<Client> {
  const agent = request.agent(app);
  const c: Client = {
    agent,
    csrf: '',
    async refreshCsrf() {
      const res = await agent.get('/api/auth/csrf').expect(200);
      c.csrf = res.body.token;
      return c.csrf;
    },
    post: (path, body = {}) => agent.post(path).set('X-CSRF-Token', c.csrf).send(body),
    patch: (path, body = {}) => agent.patch(path).set('X-CSRF-Token', c.csrf).send(body),
    get: (path) => agent.get(path),
  };
  await c.refreshCsrf();
  return c;
}

/** A client signed in as the user (with the new session's CSRF token). */
export async function signedIn(app: Express, user: Pick<TestUser, 'email' | 'password'>): Promise<Client> {
  const c = await client(app);
  const res = await c.post('/api/auth/sign-in', { email: user.email, password: user.password });
  if (res.status !== 200)
    throw new Error(`sign-in failed for ${user.email}: ${res.status} ${JSON.stringify(res.body)}`);
  await c.refreshCsrf();
  return c;
}

/** Waits for mail to an address to reach the fake, reading it through the admin's outbox. */
export async function waitForMail(admin: Client, to: string, count = 1, timeoutMs = 10_000): Promise<OutboxMessage[]> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const res = await admin.get(`/api/dev/outbox?to=${encodeURIComponent(to)}`).expect(200);
    const messages = res.body.messages as OutboxMessage[];
    if (messages.length >= count) return messages;
    if (Date.now() > deadline) throw new Error(`no mail for ${to} within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}
