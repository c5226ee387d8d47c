import { and, asc, eq, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { assignments, studios, users, weeklySummaries } from '../../db/schema';
import type { Mailer } from '../../mail/mailer';
import { type SummaryLine, weeklySummaryMail } from '../../mail/templates/weekly-summary';
import { assignmentProgress } from '../assignments/progress';

/** One advisory lock key for the weekly summary, shared by every server instance. */
export const SUMMARY_LOCK_KEY = 0x5f_5e_09;

/** The Monday (UTC) of the week `now` falls in, as YYYY-MM-DD. */
export function weekOf(now: Date): string {
  const d = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate()));
  d.setUTCDate(d.getUTCDate() - ((d.getUTCDay() + 6) % 7));
  return d.toISOString().slice(0, 10);
}

export interface SummaryRun {
  /** another instance holds the lock: this one sent nothing */
  locked: boolean;
  sent: number;
  week: string;
}

async function summaryFor(
  db: Db,
  studio: { id: string; name: string; teacherName: string; teacherEmail: string },
  week: string,
  origin: string,
) {
  const players = await db.execute<{ id: string; name: string; takes: number; accuracy: number | null }>(sql`
    SELECT u.id, u.name, count(t.id)::int AS takes, avg(t.accuracy)::float8 AS accuracy
    FROM studio_members m
    JOIN users u ON u.id = m.player_id
    LEFT JOIN takes t ON t.player_id = u.id AND t.started_at > now() - interval '7 days'
    WHERE m.studio_id = ${studio.id}::uuid
    GROUP BY u.id, u.name
    ORDER BY u.name`);
  const rows = await db.select({ id: assignments.id }).from(assignments).where(eq(assignments.studioId, studio.id));
  const progress = await assignmentProgress(
    db,
    rows.map((r) => r.id),
  );
  const all = [...progress.values()].flat();
  const lines: SummaryLine[] = players.rows.map((p) => ({
    player: p.name,
    takes: p.takes,
    accuracy: p.accuracy,
    met: all.filter((x) => x.playerId === p.id && x.status === 'met').length,
    overdue: all.filter((x) => x.playerId === p.id && x.status === 'overdue').length,
  }));
  return weeklySummaryMail({
    to: studio.teacherEmail,
    teacher: studio.teacherName,
    studio: studio.name,
    week,
    assignments: rows.length,
    lines,
    link: `${origin}/studio/${studio.id}`,
  });
}

/**
 * Sends each studio's weekly summary to its teacher, once per studio and week. Every server
 * instance may call this on its own schedule: a transaction-scoped advisory lock lets one in
 * at a time (the others return at once), and a row per studio and week remembers what went
 * out, so a later call the same week sends nothing. `force` sends again even so (the command).
 */
export async function sendWeeklySummaries(
  db: Db,
  mailer: Mailer,
  opts: { origin: string; now?: Date; force?: boolean },
): Promise<SummaryRun> {
  const week = weekOf(opts.now ?? new Date());
  return db.transaction(async (tx) => {
    const lock = await tx.execute<{ ok: boolean }>(sql`SELECT pg_try_advisory_xact_lock(${SUMMARY_LOCK_KEY}) AS ok`);
    if (!lock.rows[0]?.ok) return { locked: true, sent: 0, week };
    const list = await tx
      .select({
        id: studios.id,
        name: studios.name,
        teacherName: users.name,
        teacherEmail: users.email,
        sent: weeklySummaries.week,
      })
      .from(studios)
      .innerJoin(users, eq(users.id, studios.teacherId))
      .leftJoin(weeklySummaries, and(eq(weeklySummaries.studioId, studios.id), eq(weeklySummaries.week, week)))
      .where(eq(users.disabled, false))
      .orderBy(asc(studios.createdAt));
    let sent = 0;
    for (const studio of list) {
      if (studio.sent && !opts.force) continue;
      try {
        await mailer.send(await summaryFor(db, studio, week, opts.origin));
      } catch (err) {
        // Not recorded: the next hourly run tries this studio again.
        console.error(`[summary] ${studio.name}:`, err instanceof Error ? err.message : err);
        continue;
      }
      await tx
        .insert(weeklySummaries)
        .values({ studioId: studio.id, week })
        .onConflictDoUpdate({ target: [weeklySummaries.studioId, weeklySummaries.week], set: { sentAt: new Date() } });
      sent += 1;
    }
    return { locked: false, sent, week };
  });
}

/** The in-process schedule: hourly, each instance tries; the lock and the week rows make it once. */
export function scheduleWeeklySummaries(db: Db, mailer: Mailer, origin: string, everyMs = 60 * 60_000): () => void {
  const run = () =>
    sendWeeklySummaries(db, mailer, { origin })
      .then((r) => r.sent > 0 && console.log(`[summary] sent ${r.sent} weekly summaries for the week of ${r.week}`))
      .catch((err: unknown) => console.error('[summary] failed:', err instanceof Error ? err.message : err));
  const first = setTimeout(run, 60_000);
  const timer = setInterval(run, everyMs);
  first.unref();
  timer.unref();
  return () => {
    clearTimeout(first);
    clearInterval(timer);
  };
}
