import type { User } from '../../../shared/schemas/auth';
import type { Studio } from '../../../shared/schemas/studios';
import type { Db } from '../../db/client';
import { notFound } from '../../errors';
import { presentStudios } from './present-studios';
import { visibleStudioIds } from './visible-studio-ids';

/** One studio, if the user may see it; otherwise 404, so another's studio isn't revealed. */
export async function getStudio(db: Db, user: User, id: string): Promise<Studio> {
  const ids = await visibleStudioIds(db, user);
  if (!ids.includes(id)) throw notFound('That studio');
  const [studio] = await presentStudios(db, user, [id]);
  if (!studio) throw notFound('That studio');
  return studio;
}
