import type { User } from '../../../shared/schemas/auth';
import type { Studio } from '../../../shared/schemas/studios';
import type { Db } from '../../db/client';
import { presentStudios } from './present-studios';
import { visibleStudioIds } from './visible-studio-ids';

/** The studios the user teaches, belongs to, or (admin) all of them. */
export async function listStudios(db: Db, user: User): Promise<Studio[]> {
  return presentStudios(db, user, await visibleStudioIds(db, user));
}
