import type { Db } from '../../db/client';
import { devOutbox } from '../../db/schema';

/** Files one received e-mail in the outbox, once per recipient. */
export async function recordOutboxMessages(
  db: Db,
  msg: { recipients: string[]; from: string; subject: string; text: string; html: string },
): Promise<void> {
  if (msg.recipients.length === 0) return;
  await db
    .insert(devOutbox)
    .values(msg.recipients.map((to) => ({ to, from: msg.from, subject: msg.subject, text: msg.text, html: msg.html })));
}
