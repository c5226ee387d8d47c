import { and, count, eq, gt, lt, max, sql } from 'drizzle-orm';
import type { SignInInput, User } from '../../../shared/schemas/auth';
import type { Db } from '../../db/client';
import { signInFailures, users } from '../../db/schema';
import { AppError, rateLimited } from '../../errors';
import { verifyAgainstNothing, verifyPassword } from './password-hash';
import { presentUser } from './present-user';

/** Failures older than this count for nothing. */
export const SIGN_IN_WINDOW_MS = 15 * 60_000;
/** Failures one source may make on one account before it is slowed down. */
export const SIGN_IN_PAIR_LIMIT = 5;
/** Failures on one account, from all sources, that make every source that failed on it wait. */
export const SIGN_IN_ACCOUNT_LIMIT = 20;
const FIRST_WAIT_MS = 60_000;
const LONGEST_WAIT_MS = 15 * 60_000;

export interface SignInLimits {
  /** failures from one source across all accounts before that source is slowed down */
  sourceLimit?: number;
}

const mismatch = () => new AppError('unauthenticated', "That e-mail and password don't match an account");

/** After `limit` failures a wait of one minute, doubling with each further failure, at most 15. */
export function waitAfter(failures: number, limit: number): number {
  if (failures < limit) return 0;
  return Math.min(LONGEST_WAIT_MS, FIRST_WAIT_MS * 2 ** (failures - limit));
}

async function failuresWhere(db: Db, where: ReturnType<typeof and>) {
  const [row] = await db
    .select({ n: count(), last: max(signInFailures.at) })
    .from(signInFailures)
    .where(where);
  return { n: row?.n ?? 0, last: row?.last ? new Date(row.last).getTime() : 0 };
}

/**
 * How long this source must wait before trying this account again (0: go ahead). The rule:
 * - one source (IP address) and one account: 5 failures in 15 minutes, then a wait of 1 minute
 *   after the latest failure, doubling with each further failure (at most 15 minutes);
 * - one source across all accounts: the same, after `sourceLimit` failures (guessing many accounts);
 * - an account with 20 failures in 15 minutes from all sources: any source that has itself
 *   failed on it waits a minute between tries.
 * A source with no recent failures is never held, so the right password from a new address
 * always gets through: nobody can lock an owner out by failing on their account.
 */
async function waitFor(db: Db, email: string, ip: string, sourceLimit: number): Promise<number> {
  const since = new Date(Date.now() - SIGN_IN_WINDOW_MS);
  const recent = gt(signInFailures.at, since);
  const [pair, source, account] = await Promise.all([
    failuresWhere(db, and(eq(signInFailures.email, email), eq(signInFailures.ip, ip), recent)),
    failuresWhere(db, and(eq(signInFailures.ip, ip), recent)),
    failuresWhere(db, and(eq(signInFailures.email, email), recent)),
  ]);
  const now = Date.now();
  let until = Math.max(
    pair.last + waitAfter(pair.n, SIGN_IN_PAIR_LIMIT),
    source.last + waitAfter(source.n, sourceLimit),
  );
  if (account.n >= SIGN_IN_ACCOUNT_LIMIT && pair.n > 0) until = Math.max(until, pair.last + FIRST_WAIT_MS);
  return Math.max(0, until - now);
}

async function recordFailure(db: Db, email: string, ip: string) {
  await db.insert(signInFailures).values({ email, ip });
  // Keep the table small: rows past the window count for nothing.
  await db.delete(signInFailures).where(lt(signInFailures.at, sql`now() - interval '1 hour'`));
}

/**
 * Checks an e-mail and password. Failures are counted in PostgreSQL (so every instance agrees)
 * per account and source together, and slow a guesser down rather than lock the account; see
 * `waitFor` for the rule. A held attempt is answered 429 with Retry-After, before any password
 * is checked.
 */
export async function signIn(db: Db, input: SignInInput & { ip: string }, limits: SignInLimits = {}): Promise<User> {
  const wait = await waitFor(db, input.email, input.ip, limits.sourceLimit ?? 20);
  if (wait > 0) {
    const seconds = Math.ceil(wait / 1000);
    throw rateLimited(
      `Too many failed sign-ins from here; try again in ${seconds < 90 ? `${seconds} seconds` : `${Math.ceil(seconds / 60)} minutes`}, or reset your password`,
      seconds,
    );
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
  // A good sign-in clears this source's own failures on the account (others' stay counted).
  await db.delete(signInFailures).where(and(eq(signInFailures.email, input.email), eq(signInFailures.ip, input.ip)));
  return presentUser(user);
}
