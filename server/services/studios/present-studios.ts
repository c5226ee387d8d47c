import { asc, count, eq, inArray } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { Studio } from '../../../shared/schemas/studios';
import type { Db } from '../../db/client';
import { studioMembers, studios, users } from '../../db/schema';

/** Studios as the API shows them; the member list only to the studio's teacher and admins. */
export async function presentStudios(db: Db, viewer: User, ids: string[]): Promise<Studio[]> {
  if (ids.length === 0) return [];
  const rows = await db
    .select({
      id: studios.id,
      name: studios.name,
      teacherId: users.id,
      teacherName: users.name,
      teacherEmail: users.email,
    })
    .from(studios)
    .innerJoin(users, eq(users.id, studios.teacherId))
    .where(inArray(studios.id, ids))
    .orderBy(asc(studios.name));
  const counts = await db
    .select({ studioId: studioMembers.studioId, n: count() })
    .from(studioMembers)
    .where(inArray(studioMembers.studioId, ids))
    .groupBy(studioMembers.studioId);
  const countOf = new Map(counts.map((c) => [c.studioId, c.n]));
  const members = await db
    .select({ studioId: studioMembers.studioId, id: users.id, name: users.name, joinedAt: studioMembers.joinedAt })
    .from(studioMembers)
    .innerJoin(users, eq(users.id, studioMembers.playerId))
    .where(inArray(studioMembers.studioId, ids))
    .orderBy(asc(users.name));
  return rows.map((r) => {
    const role = viewer.id === r.teacherId ? 'teacher' : viewer.role === 'admin' ? 'admin' : 'player';
    const mayList = role !== 'player';
    return {
      id: r.id,
      name: r.name,
      role,
      teacher: { id: r.teacherId, name: r.teacherName, email: r.teacherEmail },
      playerCount: countOf.get(r.id) ?? 0,
      ...(mayList
        ? {
            members: members
              .filter((m) => m.studioId === r.id)
              .map((m) => ({ id: m.id, name: m.name, joinedAt: m.joinedAt.toISOString() })),
          }
        : {}),
    };
  });
}
