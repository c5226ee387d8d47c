import { and, eq, inArray } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { studioMembers, studios, users } from '../../server/db/schema';
import { DEMO_ACCOUNTS, DEMO_PASSWORD, DEMO_STUDIO, seedDemo } from '../../server/db/seed';
import { signedIn } from '../helpers/factories';
import { createTestApp } from '../helpers/test-server';

const ctx = createTestApp();
afterAll(() => ctx.close());

describe('demo seed', () => {
  it('creates the five demo accounts and the studio, and a rerun adds nothing', async () => {
    await seedDemo(ctx.db);
    await seedDemo(ctx.db);
    const emails = DEMO_ACCOUNTS.map((a) => a.email);
    const rows = await ctx.db.select().from(users).where(inArray(users.email, emails));
    expect(rows.map((r) => [r.email, r.name, r.role]).sort()).toEqual(
      [
        ['admin@sixfold.test', 'Desk', 'admin'],
        ['alto@sixfold.test', 'Ines Duarte', 'player'],
        ['player@sixfold.test', 'Theo Park', 'player'],
        ['teacher@sixfold.test', 'Mara Quill', 'teacher'],
        ['wind@sixfold.test', 'Sam Okafor', 'player'],
      ].sort(),
    );
    const mara = rows.find((r) => r.email === 'teacher@sixfold.test')!;
    // Other tests may make studios of the same name; the demo one is Mara's.
    const found = await ctx.db
      .select()
      .from(studios)
      .where(and(eq(studios.name, DEMO_STUDIO), eq(studios.teacherId, mara.id)));
    expect(found).toHaveLength(1);
    const members = await ctx.db.select().from(studioMembers).where(eq(studioMembers.studioId, found[0].id));
    expect(members).toHaveLength(3);
  });

  it('lets every demo account sign in with the demo password', async () => {
    await seedDemo(ctx.db);
    for (const account of DEMO_ACCOUNTS) {
      const c = await signedIn(ctx.app, { email: account.email, password: DEMO_PASSWORD });
      const me = await c.get('/api/auth/me').expect(200);
      expect(me.body.user.role).toBe(account.role);
    }
  });
});
