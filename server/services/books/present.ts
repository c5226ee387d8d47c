import { asc, eq, inArray } from 'drizzle-orm';
import { presets } from '../../../shared/engine';
import type { Book, BookAccess, BookDrill, BookDrillEntry } from '../../../shared/schemas/books';
import { drillMaterial } from '../../../shared/practice/drill-identity';
import type { DrillSpec } from '../../../shared/schemas/drills';
import type { Db } from '../../db/client';
import { type BookDrillRow, type BookRow, bookDrills, users } from '../../db/schema';

/** "D / C over D7 · four-three": what a contents line says about a drill without giving it away. */
export function drillSummary(spec: DrillSpec): string {
  const pattern = typeof spec.pattern === 'string' ? presets[spec.pattern].name : spec.pattern.name;
  return `${drillMaterial(spec, ' / ')}${spec.chord ? ` over ${spec.chord}` : ''} · ${pattern}`;
}

export function presentEntry(row: BookDrillRow): BookDrillEntry {
  return {
    id: row.id,
    title: row.title,
    note: row.note,
    free: row.free,
    summary: drillSummary(row.spec),
    keyCycle: row.keyCycle ?? null,
  };
}

export function presentBookDrill(row: BookDrillRow): BookDrill {
  return { id: row.id, title: row.title, note: row.note, spec: row.spec, keyCycle: row.keyCycle ?? null };
}

/** The drills of some books, in order, by book id. */
export async function drillsByBook(db: Db, bookIds: string[]): Promise<Map<string, BookDrillRow[]>> {
  const map = new Map<string, BookDrillRow[]>(bookIds.map((id) => [id, []]));
  if (bookIds.length === 0) return map;
  const rows = await db
    .select()
    .from(bookDrills)
    .where(inArray(bookDrills.bookId, bookIds))
    .orderBy(asc(bookDrills.bookId), asc(bookDrills.position));
  for (const r of rows) map.get(r.bookId)?.push(r);
  return map;
}

export async function teachersById(db: Db, ids: string[]): Promise<Map<string, { id: string; name: string }>> {
  if (ids.length === 0) return new Map();
  const rows = await db
    .select({ id: users.id, name: users.name })
    .from(users)
    .where(inArray(users.id, [...new Set(ids)]));
  return new Map(rows.map((r) => [r.id, r]));
}

export function presentBook(
  row: BookRow,
  teacher: { id: string; name: string },
  drills: BookDrillRow[],
  access: BookAccess,
): Book {
  return {
    id: row.id,
    title: row.title,
    description: row.description,
    coverColour: row.coverColour,
    priceMinor: row.priceMinor,
    currency: row.currency,
    published: row.published,
    teacher,
    drills: drills.map(presentEntry),
    access,
    updatedAt: row.updatedAt.toISOString(),
  };
}

/** One book as the API shows it to a viewer with the given access. */
export async function presentOne(db: Db, row: BookRow, access: BookAccess): Promise<Book> {
  const [teacher] = await db.select({ id: users.id, name: users.name }).from(users).where(eq(users.id, row.teacherId));
  const drills = await drillsByBook(db, [row.id]);
  return presentBook(row, teacher, drills.get(row.id) ?? [], access);
}
