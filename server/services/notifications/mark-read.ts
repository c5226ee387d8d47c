import { and, eq, isNull } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { notifications } from '../../db/schema';

/** Marks every unread notification of the user as read. */
export async function markNotificationsRead(db: Db, userId: string): Promise<void> {
  await db
    .update(notifications)
    .set({ readAt: new Date() })
    .where(and(eq(notifications.userId, userId), isNull(notifications.readAt)));
}
