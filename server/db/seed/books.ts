import { and, eq } from 'drizzle-orm';
import type { DrillSpec, KeyOrder } from '../../../shared/schemas/drills';
import type { Db } from '../client';
import { bookDrills, books, savedDrills, users } from '../schema';

export const DEMO_BOOK_TITLE = 'Pairs for the Tuesday combo';

/**
 * The drills of Mara's book (docs/demo-scenario.md), in order: the free starter first. No instrument is
 * set, so each player practises and prints them for their own.
 */
const DRILLS: {
  name: string;
  title: string;
  spec: DrillSpec;
  keyCycle: KeyOrder | null;
  note: string;
  free?: boolean;
}[] = [
  {
    name: 'Starter: stack on C/D over Cmaj7#11',
    title: 'Starter: C/D over Cmaj7#11',
    spec: { pair: ['C', 'D'], pattern: 'stack', direction: 'up-down', chord: 'Cmaj7#11', tempo: 72 },
    keyCycle: null,
    note: 'Hear the D triad as the colour on top: 9, #11 and 13 of the chord. Slow enough to sing every note.',
    free: true,
  },
  {
    name: 'Four-three on D/C over D7',
    title: 'Four-three on D/C over D7, all keys',
    spec: { pair: ['D', 'C'], pattern: 'four-three', direction: 'up', tempo: 100, chord: 'D7' },
    keyCycle: 'chromatic',
    note: 'Groups of four then three cross the bar line; keep the eighths even and land the downbeat on time.',
  },
  {
    name: 'Scale-steps on Bbm/Ab over Bbm7',
    title: 'Scale-steps on Bbm/Ab over Bbm7, in fourths',
    spec: { pair: ['Bbm', 'Ab'], pattern: 'scale-steps', direction: 'up', tempo: 88, chord: 'Bbm7' },
    keyCycle: 'fourths',
    note: 'Say the next key out loud before the count-in; the fourths order is the order of most tunes.',
  },
  {
    name: 'Weave on G/Db over G7',
    title: 'Weave on G/Db over G7',
    spec: { pair: ['G', 'Db'], pattern: 'weave', direction: 'up-down', tempo: 92, chord: 'G7' },
    keyCycle: 'fifths',
    note: 'Two triads a tritone apart over a dominant: the Db triad is the altered colour. Lean on its top note.',
  },
  {
    name: 'Leap-back on A/G over Em7',
    title: 'Leap-back on A/G over Em7',
    spec: { pair: ['A', 'G'], pattern: 'leap-back', direction: 'up', tempo: 96, chord: 'Em7' },
    keyCycle: 'chromatic',
    note: 'A dorian sound: the A triad carries the 6th. Let the leaps ring, then step back without rushing.',
  },
];

async function ensureSavedDrill(db: Db, ownerId: string, d: (typeof DRILLS)[number]): Promise<string> {
  const [found] = await db
    .select({ id: savedDrills.id })
    .from(savedDrills)
    .where(and(eq(savedDrills.ownerId, ownerId), eq(savedDrills.name, d.name)))
    .limit(1);
  if (found) return found.id;
  const [made] = await db
    .insert(savedDrills)
    .values({ ownerId, name: d.name, spec: d.spec, keyOrder: d.keyCycle })
    .returning({ id: savedDrills.id });
  return made.id;
}

/** Mara's published, priced drill book with its free starter drill. Checks for itself, so a rerun adds nothing twice. */
export async function seedDemoBooks(db: Db): Promise<void> {
  const [mara] = await db.select({ id: users.id }).from(users).where(eq(users.email, 'teacher@sixfold.test'));
  if (!mara) return;
  const [exists] = await db
    .select({ id: books.id })
    .from(books)
    .where(and(eq(books.teacherId, mara.id), eq(books.title, DEMO_BOOK_TITLE)))
    .limit(1);
  if (exists) return;
  const savedIds: string[] = [];
  for (const d of DRILLS) savedIds.push(await ensureSavedDrill(db, mara.id, d));
  await db.transaction(async (tx) => {
    const [book] = await tx
      .insert(books)
      .values({
        teacherId: mara.id,
        title: DEMO_BOOK_TITLE,
        description:
          'The pairs we play over the Tuesday combo’s tunes, each as a drill you practise and get scored on, in all twelve keys. Start with the free one on C/D; the rest follow the changes of the set list.',
        coverColour: 'ink',
        priceMinor: 1200,
        currency: 'EUR',
        published: true,
        publishedAt: new Date(),
      })
      .returning({ id: books.id });
    await tx.insert(bookDrills).values(
      DRILLS.map((d, position) => ({
        bookId: book.id,
        position,
        savedDrillId: savedIds[position],
        title: d.title,
        note: d.note,
        spec: d.spec,
        keyCycle: d.keyCycle,
        free: d.free ?? false,
      })),
    );
  });
}
