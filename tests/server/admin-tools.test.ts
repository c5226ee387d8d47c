import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type Client, createUser, signedIn, type TestUser } from '../helpers/factories';
import { createTestApp } from '../helpers/test-server';

const ctx = createTestApp();
afterAll(() => ctx.close());

let admin: Client;
let adminUser: TestUser;

beforeAll(async () => {
  adminUser = await createUser(ctx.db, { role: 'admin', name: 'Desk' });
  admin = await signedIn(ctx.app, adminUser);
});

describe('admin: roles, switching accounts off, the audit log', () => {
  it('changes a role and writes it to the audit log', async () => {
    const user = await createUser(ctx.db, { role: 'player', name: 'Ines Duarte' });
    const res = await admin.patch(`/api/admin/users/${user.id}`, { role: 'teacher' }).expect(200);
    expect(res.body.user).toMatchObject({ id: user.id, role: 'teacher', disabled: false });
    const audit = await admin.get('/api/admin/audit').expect(200);
    expect(audit.body.entries[0]).toMatchObject({
      action: 'role.change',
      actor: { id: adminUser.id, name: 'Desk' },
      target: { id: user.id, name: 'Ines Duarte' },
      detail: { from: 'player', to: 'teacher' },
    });
    // the new role counts at once for a session already open
    const c = await signedIn(ctx.app, user);
    expect((await c.get('/api/auth/me').expect(200)).body.user.role).toBe('teacher');
    await admin.patch(`/api/admin/users/${user.id}`, { role: 'player' }).expect(200);
    expect((await c.get('/api/auth/me').expect(200)).body.user.role).toBe('player');
  });

  it("a disabled account's session stops working and it cannot sign in again; enabling lets it back", async () => {
    const user = await createUser(ctx.db, { role: 'player' });
    const c = await signedIn(ctx.app, user);
    await c.get('/api/auth/me').expect(200);
    await admin.patch(`/api/admin/users/${user.id}`, { disabled: true }).expect(200);
    expect((await c.get('/api/auth/me')).status).toBe(401);
    expect((await c.get('/api/studios')).status).toBe(401);
    const rows = await ctx.pool.query(`SELECT count(*)::int AS n FROM session WHERE sess->>'userId' = $1`, [user.id]);
    expect(rows.rows[0].n).toBe(0);
    await expect(signedIn(ctx.app, user)).rejects.toThrow(/401/);
    const audit = await admin.get('/api/admin/audit').expect(200);
    expect(audit.body.entries[0]).toMatchObject({ action: 'account.disable', target: { id: user.id } });
    await admin.patch(`/api/admin/users/${user.id}`, { disabled: false }).expect(200);
    await signedIn(ctx.app, user);
  });

  it('is for admins only, refuses changing oneself, and names a bad field', async () => {
    const user = await createUser(ctx.db, { role: 'teacher' });
    const t = await signedIn(ctx.app, user);
    expect((await t.patch(`/api/admin/users/${user.id}`, { role: 'admin' })).status).toBe(403);
    expect((await t.get('/api/admin/audit')).status).toBe(403);
    expect((await admin.patch(`/api/admin/users/${adminUser.id}`, { disabled: true })).status).toBe(400);
    const bad = await admin.patch(`/api/admin/users/${user.id}`, { role: 'owner' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.role).toBeDefined();
    expect(
      (await admin.patch('/api/admin/users/00000000-0000-4000-8000-000000000000', { role: 'player' })).status,
    ).toBe(404);
  });
});
