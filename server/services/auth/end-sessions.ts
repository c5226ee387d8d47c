import { and, ne, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { session } from '../../db/schema';

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

/** Signs a user out everywhere (except, optionally, the session making the change). */
export async function endSessions(db: Db | Tx, userId: string, exceptSid?: string): Promise<void> {
  const ofUser = sql`${session.sess}->>'userId' = ${userId}`;
  await db.delete(session).where(exceptSid ? and(ofUser, ne(session.sid, exceptSid)) : ofUser);
}
