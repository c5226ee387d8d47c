import type { User } from '../../../shared/schemas/auth';
import type { CustomPattern } from '../../../shared/schemas/drills';
import type { CustomPatternRow } from '../../db/schema';

/** A custom pattern as the API shows it: with its owner's name, and whether the viewer owns it. */
export function presentCustomPattern(
  row: CustomPatternRow,
  owner: CustomPattern['owner'],
  viewer: User,
): CustomPattern {
  return {
    id: row.id,
    name: row.name,
    def: row.def,
    owner,
    mine: row.ownerId === viewer.id,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}
