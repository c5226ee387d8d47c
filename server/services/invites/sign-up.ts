import type { User } from '../../../shared/schemas/auth';
import type { InviteSignUpInput } from '../../../shared/schemas/studios';
import type { Db } from '../../db/client';
import { users } from '../../db/schema';
import { AppError } from '../../errors';
import { hashPassword } from '../auth/password-hash';
import { presentUser } from '../auth/present-user';
import { joinThroughInvite } from './accept';
import { findUsableInvite } from './find';

/**
 * An invited address without an account signs up through the link: a player account on the
 * invited address (the link proves the address), joined to the studio, all in one transaction.
 */
export async function signUpThroughInvite(db: Db, token: string, input: InviteSignUpInput): Promise<User> {
  const { invite } = await findUsableInvite(db, token);
  const passwordHash = await hashPassword(input.password);
  return db.transaction(async (tx) => {
    const rows = await tx
      .insert(users)
      .values({ email: invite.email, name: input.name, role: 'player', passwordHash })
      .onConflictDoNothing({ target: users.email })
      .returning();
    if (rows.length === 0) {
      throw new AppError('conflict', 'An account already uses this address; sign in, then accept the invite', {
        email: ['An account already uses this address; sign in, then accept the invite'],
      });
    }
    const user = presentUser(rows[0]);
    await joinThroughInvite(tx, token, user);
    return user;
  });
}
