import { bigserial, index, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { users } from './users';

/** What admins did to accounts: every role change, every account switched off or on. */
export const auditLog = pgTable(
  'audit_log',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    actorId: uuid('actor_id').references(() => users.id, { onDelete: 'set null' }),
    targetId: uuid('target_id').references(() => users.id, { onDelete: 'set null' }),
    action: text('action').$type<'role.change' | 'account.disable' | 'account.enable' | 'purchase.refund'>().notNull(),
    detail: jsonb('detail').$type<Record<string, string | boolean>>().notNull(),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('audit_log_at_idx').on(t.at)],
);
