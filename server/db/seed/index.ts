import { seedDemoSettings } from './settings';
import { and, eq } from 'drizzle-orm';
import { hashPassword } from '../../services/auth/password-hash';
import type { Db } from '../client';
import { studioMembers, studios, users } from '../schema';
import { seedStudioWeek } from './studio';
import { seedDemoHistory } from './history';
import { seedDemoBooks } from './books';

export const DEMO_PASSWORD = 'sixfold-demo';
export const DEMO_STUDIO = 'Harbour Lane Music Collective';

/** The demo accounts (docs/demo-scenario.md). */
export const DEMO_ACCOUNTS = [
  { email: 'admin@sixfold.test', name: 'Desk', role: 'admin' },
  { email: 'teacher@sixfold.test', name: 'Mara Quill', role: 'teacher' },
  { email: 'player@sixfold.test', name: 'Theo Park', role: 'player' },
  { email: 'alto@sixfold.test', name: 'Ines Duarte', role: 'player' },
  { email: 'wind@sixfold.test', name: 'Sam Okafor', role: 'player' },
] as const;

async function ensureAccount(db: Db, account: (typeof DEMO_ACCOUNTS)[number]): Promise<string> {
  const [found] = await db.select({ id: users.id }).from(users).where(eq(users.email, account.email)).limit(1);
  if (found) return found.id;
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  await db
    .insert(users)
    .values({ ...account, passwordHash })
    .onConflictDoNothing({ target: users.email });
  const [made] = await db.select({ id: users.id }).from(users).where(eq(users.email, account.email)).limit(1);
  return made.id;
}

/**
 * Seeds the invented demo world (docs/demo-scenario.md) into an empty database.
 * Each part checks for itself, so a rerun adds nothing twice.
 */
export async function seedDemo(db: Db): Promise<void> {
  const ids = new Map<string, string>();
  for (const account of DEMO_ACCOUNTS) ids.set(account.email, await ensureAccount(db, account));

  const teacherId = ids.get('teacher@sixfold.test')!;
  let [studio] = await db
    .select({ id: studios.id })
    .from(studios)
    .where(and(eq(studios.teacherId, teacherId), eq(studios.name, DEMO_STUDIO)))
    .limit(1);
  if (!studio)
    [studio] = await db.insert(studios).values({ name: DEMO_STUDIO, teacherId }).returning({ id: studios.id });

  for (const email of ['player@sixfold.test', 'alto@sixfold.test', 'wind@sixfold.test']) {
    await db
      .insert(studioMembers)
      .values({ studioId: studio.id, playerId: ids.get(email)! })
      .onConflictDoNothing();
  }

  await seedDemoSettings(db, ids);
  await seedDemoHistory(db);

  // Last, so the demo takes (seeded above, when there) can carry a remark.
  await seedStudioWeek(db, studio.id);
  await seedDemoBooks(db);
}
