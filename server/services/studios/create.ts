import type { User } from '../../../shared/schemas/auth';
import type { CreateStudioInput, StudioDetail } from '../../../shared/schemas/studios';
import type { Db } from '../../db/client';
import { studios } from '../../db/schema';
import { getStudio } from './get';

/** A new, empty studio taught by the user. */
export async function createStudio(db: Db, teacher: User, input: CreateStudioInput): Promise<StudioDetail> {
  const [row] = await db
    .insert(studios)
    .values({ name: input.name, teacherId: teacher.id })
    .returning({ id: studios.id });
  return getStudio(db, teacher, row.id);
}
