import { and, eq } from 'drizzle-orm';
import { Midi } from 'tonal';
import type { User } from '../../../shared/schemas/auth';
import type { CreateRemarkInput, Remark } from '../../../shared/schemas/remarks';
import type { Db } from '../../db/client';
import { notifications, remarks, studios, takeNotes, users } from '../../db/schema';
import { AppError, notFound } from '../../errors';
import type { Mailer } from '../../mail/mailer';
import { takeRemarkMail } from '../../mail/templates/take-remark';
import { getTake } from '../takes/get';
import { selectRemarks } from './present';
import { sharedStudioIds } from './visible-studios';

const fieldError = (field: string, message: string) => new AppError('validation', message, { [field]: [message] });

/**
 * A teacher remarks on a player's take (optionally pinned to one note), or the player answers
 * a remark. The player is told in the app and by e-mail; the teacher, of an answer, in the app.
 */
export async function createRemark(
  db: Db,
  mailer: Mailer,
  author: User,
  takeId: string,
  input: CreateRemarkInput & { origin: string | null },
): Promise<Remark> {
  const take = await getTake(db, author, takeId);
  const isPlayer = take.playerId === author.id;
  const noteIndex = input.noteIndex ?? null;
  if (noteIndex !== null && noteIndex >= take.noteCount)
    throw fieldError('noteIndex', `This take has ${take.noteCount} notes; pin the remark to one of them`);

  let studioId: string;
  let parentId: string | null = null;
  if (input.parentId) {
    const [parent] = await db
      .select()
      .from(remarks)
      .where(and(eq(remarks.id, input.parentId), eq(remarks.takeId, takeId)))
      .limit(1);
    const allowed =
      parent && (isPlayer || (await sharedStudioIds(db, author.id, take.playerId)).includes(parent.studioId));
    if (!allowed) throw notFound('That remark');
    studioId = parent.studioId;
    parentId = parent.parentId ?? parent.id;
  } else {
    if (isPlayer) throw fieldError('parentId', 'Answer one of your teacher’s remarks');
    const shared = await sharedStudioIds(db, author.id, take.playerId);
    if (shared.length === 0) throw notFound('That take');
    studioId = shared[0];
  }

  const [row] = await db
    .insert(remarks)
    .values({ takeId, studioId, authorId: author.id, parentId, noteIndex, body: input.body })
    .returning({ id: remarks.id });
  const link = `/takes/${takeId}`;
  const drillName = `${take.pair} ${take.pattern} in ${take.key}`;
  if (isPlayer) {
    const [studio] = await db.select({ teacherId: studios.teacherId }).from(studios).where(eq(studios.id, studioId));
    await db.insert(notifications).values({
      userId: studio.teacherId,
      kind: 'reply',
      text: `${author.name} answered your remark on ${drillName}`,
      link,
    });
  } else {
    let pinned: string | null = null;
    if (noteIndex !== null) {
      const [n] = await db
        .select({ midi: takeNotes.midi, measure: takeNotes.measure, verdict: takeNotes.verdict })
        .from(takeNotes)
        .where(and(eq(takeNotes.takeId, takeId), eq(takeNotes.idx, noteIndex)));
      pinned = n
        ? `note ${noteIndex + 1} (${Midi.midiToNoteName(n.midi)}, measure ${n.measure}, ${n.verdict})`
        : `note ${noteIndex + 1}`;
    }
    await db
      .insert(notifications)
      .values({ userId: take.playerId, kind: 'remark', text: `${author.name} left a remark on ${drillName}`, link });
    const [player] = await db
      .select({ email: users.email, name: users.name })
      .from(users)
      .where(eq(users.id, take.playerId));
    if (input.origin) {
      const mail = takeRemarkMail({
        to: player.email,
        player: player.name,
        teacher: author.name,
        take: drillName,
        body: input.body,
        pinned,
        link: `${input.origin}${link}`,
      });
      // The remark is saved either way; the e-mail is a courtesy that must not hold up the page.
      mailer
        .send(mail)
        .catch((err: unknown) =>
          console.error('[mail] the remark e-mail could not be sent:', err instanceof Error ? err.message : err),
        );
    }
  }
  const [remark] = await selectRemarks(db, eq(remarks.id, row.id));
  return remark;
}
