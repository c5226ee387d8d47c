import { desc, eq } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { AuditEntry } from '../../../shared/schemas/admin';
import type { Db } from '../../db/client';
import { auditLog, users } from '../../db/schema';

/** The audit log, newest first. */
export async function listAudit(db: Db, limit = 200): Promise<AuditEntry[]> {
  const actor = alias(users, 'actor');
  const target = alias(users, 'target');
  const rows = await db
    .select({
      entry: auditLog,
      actor: { id: actor.id, name: actor.name, email: actor.email },
      target: { id: target.id, name: target.name, email: target.email },
    })
    .from(auditLog)
    .leftJoin(actor, eq(actor.id, auditLog.actorId))
    .leftJoin(target, eq(target.id, auditLog.targetId))
    .orderBy(desc(auditLog.id))
    .limit(limit);
  return rows.map((r) => ({
    id: r.entry.id,
    at: r.entry.at.toISOString(),
    action: r.entry.action,
    actor: r.actor,
    target: r.target,
    detail: r.entry.detail,
  }));
}
