import { eq, inArray } from 'drizzle-orm';
import type { User } from '../../../shared/schemas/auth';
import type { SavedDrill } from '../../../shared/schemas/drills';
import type { Db } from '../../db/client';
import { type SavedDrillRow, users } from '../../db/schema';

type Owner = SavedDrill['owner'];

/** Owners by id, for presenting rows of several owners at once. */
export async function ownersById(db: Db, ids: string[]): Promise<Map<string, Owner>> {
  if (ids.length === 0) return new Map();
  const rows = await db
    .select({ id: users.id, name: users.name, role: users.role })
    .from(users)
    .where(inArray(users.id, ids));
  return new Map(rows.map((r) => [r.id, r]));
}

export async function ownerOf(db: Db, id: string): Promise<Owner> {
  const [row] = await db
    .select({ id: users.id, name: users.name, role: users.role })
    .from(users)
    .where(eq(users.id, id));
  return row;
}

/** A saved drill as the API shows it: with its owner's name, and whether the viewer owns it. */
export function presentSavedDrill(row: SavedDrillRow, owner: Owner, viewer: User): SavedDrill {
  return {
    id: row.id,
    name: row.name,
    spec: row.spec,
    keyOrder: row.keyOrder ?? null,
    owner,
    mine: row.ownerId === viewer.id,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}
