import type { User } from '../../../shared/schemas/auth';
import type { CreateCustomPatternInput, CustomPattern } from '../../../shared/schemas/drills';
import type { Db } from '../../db/client';
import { customPatterns } from '../../db/schema';
import { presentCustomPattern } from './present';

export async function createCustomPattern(db: Db, user: User, input: CreateCustomPatternInput): Promise<CustomPattern> {
  const [row] = await db
    .insert(customPatterns)
    .values({ ownerId: user.id, name: input.name, def: input.def })
    .returning();
  return presentCustomPattern(row, { id: user.id, name: user.name, role: user.role }, user);
}
