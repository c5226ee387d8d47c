import { and, eq } from 'drizzle-orm';
import type { DrillSpec as EngineSpec } from '../../../shared/engine';
import type { Assignment, CreateAssignmentInput } from '../../../shared/schemas/assignments';
import type { User } from '../../../shared/schemas/auth';
import type { Db } from '../../db/client';
import { assignments, notifications, savedDrills, studioMembers } from '../../db/schema';
import { AppError } from '../../errors';
import { isId } from '../drills/visible-owner-ids';
import { teacherAccess } from '../studios/access';
import { assignmentKeys } from './keys';
import { presentAssignment } from './present';

const KEY_ORDER_WORDS = { chromatic: 'chromatic', fourths: 'in fourths', fifths: 'in fifths' } as const;

/**
 * Sets one of the teacher's saved drills (one key, or the key cycle in an order) for every
 * player of the studio. The drill is copied at the target tempo, so the players open it there.
 */
export async function createAssignment(
  db: Db,
  teacher: User,
  studioId: string,
  input: CreateAssignmentInput,
): Promise<Assignment> {
  const { studio } = await teacherAccess(db, teacher, studioId);
  const [drill] = isId(input.savedDrillId)
    ? await db
        .select()
        .from(savedDrills)
        .where(and(eq(savedDrills.id, input.savedDrillId), eq(savedDrills.ownerId, studio.teacherId)))
        .limit(1)
    : [];
  if (!drill)
    throw new AppError('validation', 'Pick one of your saved drills', {
      savedDrillId: ['Pick one of your saved drills'],
    });
  const keyOrder = input.keyOrder ?? null;
  const spec = { ...drill.spec, tempo: input.targetTempo };
  const keys = assignmentKeys(spec as EngineSpec, keyOrder);
  const title =
    input.title ??
    `${drill.name}${keyOrder ? `, all keys ${KEY_ORDER_WORDS[keyOrder]}` : ''}, ${input.targetTempo} bpm`;
  const [row] = await db
    .insert(assignments)
    .values({
      studioId,
      setBy: teacher.id,
      savedDrillId: drill.id,
      title,
      spec,
      keyOrder,
      keys,
      targetTempo: input.targetTempo,
      targetAccuracy: input.targetAccuracy,
      dueAt: new Date(input.dueAt as string),
      note: input.note ?? '',
    })
    .returning();
  const members = await db
    .select({ id: studioMembers.playerId })
    .from(studioMembers)
    .where(eq(studioMembers.studioId, studioId));
  if (members.length > 0) {
    await db.insert(notifications).values(
      members.map((m) => ({
        userId: m.id,
        kind: 'assignment' as const,
        text: `New in ${studio.name}: ${title}`,
        link: '/home',
      })),
    );
  }
  return presentAssignment(
    row,
    studio.name,
    members.map((m) => ({ playerId: m.id, status: 'open' as const, keysMet: [] })),
    { id: teacher.id, seesAll: true },
  );
}
