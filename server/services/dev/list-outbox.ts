import { desc, eq } from 'drizzle-orm';
import type { OutboxMessage } from '../../../shared/schemas/dev';
import type { Db } from '../../db/client';
import { devOutbox } from '../../db/schema';

/** The latest messages the fake received (optionally for one address), newest last. */
export async function listOutbox(db: Db, opts: { to?: string; limit?: number } = {}): Promise<OutboxMessage[]> {
  const rows = await db
    .select()
    .from(devOutbox)
    .where(opts.to ? eq(devOutbox.to, opts.to) : undefined)
    .orderBy(desc(devOutbox.id))
    .limit(opts.limit ?? 200);
  return rows
    .reverse()
    .map((r) => ({ to: r.to, subject: r.subject, text: r.text, html: r.html, sentAt: r.sentAt.toISOString() }));
}
