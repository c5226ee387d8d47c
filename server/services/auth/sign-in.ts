import { and, count, eq, gt, lt, sql } from 'drizzle-orm';
import type { SignInInput, User } from '../../../shared/schemas/auth';
import type { Db } from '../../db/client';
import { signInFailures, users } from '../../db/schema';
import { AppError } from '../../errors';
import { verifyAgainstNothing, verifyPassword } from './password-hash';
import { presentUser } from './present-user';

export const SIGN_IN_WINDOW_MS = 60_000;
export const SIGN_IN_EMAIL_LIMIT = 5;

export interface SignInLimits {
  /** failures per address within the window before a 429 */
  emailLimit?: number;
  /** failures per IP within the window before a 429 */
  ipLimit?: number;
}

const mismatch = () => new AppError('unauthenticated', "That e-mail and password don't match an account");

async function recentFailures(db: Db, email: string, ip: string, since: Date) {
  const [byEmail] = await db
    .select({ n: count() })
    .from(signInFailures)
    .where(and(eq(signInFailures.email, email), gt(signInFailures.at, since)));
  const [byIp] = await db
    .select({ n: count() })
    .from(signInFailures)
    .where(and(eq(signInFailures.ip, ip), gt(signInFailures.at, since)));
  return { email: byEmail.n, ip: byIp.n };
}

async function recordFailure(db: Db, email: string, ip: string) {
  await db.insert(signInFailures).values({ email, ip });
  // Keep the table small: rows past the window count for nothing.
  await db.delete(signInFailures).where(lt(signInFailures.at, sql`now() - interval '1 hour'`));
}

/**
 * Checks an e-mail and password. Failures are counted per address and per IP in PostgreSQL,
 * so every server instance agrees; after five within a minute the next attempt gets a 429,
 * whether or not its password is right, until the minute has passed.
 */
export async function signIn(db: Db, input: SignInInput & { ip: string }, limits: SignInLimits = {}): Promise<User> {
  const emailLimit = limits.emailLimit ?? SIGN_IN_EMAIL_LIMIT;
  const ipLimit = limits.ipLimit ?? SIGN_IN_EMAIL_LIMIT;
  const since = new Date(Date.now() - SIGN_IN_WINDOW_MS);
  const failures = await recentFailures(db, input.email, input.ip, since);
  if (failures.email >= emailLimit || failures.ip >= ipLimit) {
    throw new AppError('rate_limited', 'Too many sign-in attempts in the last minute; wait a minute, then try again');
  }

  const [user] = await db.select().from(users).where(eq(users.email, input.email)).limit(1);
  if (!user) {
    await verifyAgainstNothing(input.password);
    await recordFailure(db, input.email, input.ip);
    throw mismatch();
  }
  if (!(await verifyPassword(user.passwordHash, input.password))) {
    await recordFailure(db, input.email, input.ip);
    throw mismatch();
  }
  if (user.disabled) {
    throw new AppError(
      'unauthenticated',
      'This account has been switched off; ask the admin of this Sixfold to switch it back on',
    );
  }
  // A good sign-in clears the address's own count (not the IP's).
  await db.delete(signInFailures).where(eq(signInFailures.email, input.email));
  return presentUser(user);
}
