import { and, count, desc, eq, isNull } from 'drizzle-orm';
import type { NotificationsResponse } from '../../../shared/schemas/remarks';
import type { Db } from '../../db/client';
import { notifications } from '../../db/schema';

/** The user's latest notifications and how many are unread. */
export async function listNotifications(db: Db, userId: string): Promise<NotificationsResponse> {
  const rows = await db
    .select()
    .from(notifications)
    .where(eq(notifications.userId, userId))
    .orderBy(desc(notifications.createdAt))
    .limit(30);
  const [unread] = await db
    .select({ n: count() })
    .from(notifications)
    .where(and(eq(notifications.userId, userId), isNull(notifications.readAt)));
  return {
    notifications: rows.map((r) => ({
      id: r.id,
      kind: r.kind,
      text: r.text,
      link: r.link,
      read: r.readAt !== null,
      createdAt: r.createdAt.toISOString(),
    })),
    unread: unread.n,
  };
}
