import { and, eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DrillSpec } from '../../shared/schemas/drills';
import { bookDrills, books, users } from '../../server/db/schema';
import { DEMO_BOOK_TITLE, seedDemoBooks } from '../../server/db/seed/books';
import { DEMO_PASSWORD } from '../../server/db/seed';
import { hashPassword } from '../../server/services/auth/password-hash';
import { type Client, createUser, signedIn, type TestUser } from '../helpers/factories';
import { createTestApp } from '../helpers/test-server';

const ctx = createTestApp();
afterAll(() => ctx.close());

const DC: DrillSpec = { pair: ['D', 'C'], pattern: 'four-three', direction: 'up', tempo: 100, chord: 'D7' };
const BBM: DrillSpec = { pair: ['Bbm', 'Ab'], pattern: 'scale-steps', direction: 'up', tempo: 88, chord: 'Bbm7' };
const CD: DrillSpec = { pair: ['C', 'D'], pattern: 'stack', direction: 'up-down', chord: 'Cmaj7#11' };

let mara: TestUser;
let teacher: Client;
let player: Client;
let otherTeacher: Client;

async function saveDrill(c: Client, name: string, spec: DrillSpec, keyOrder: string | null = null): Promise<string> {
  const res = await c.post('/api/drills', { name, spec, keyOrder }).expect(201);
  return res.body.drill.id;
}

/** A book of Mara's with the given drills added in order; published at a price when asked. */
async function makeBook(opts: {
  title: string;
  priceMinor?: number;
  publish?: boolean;
  drills?: [string, DrillSpec][];
}) {
  const created = await teacher
    .post('/api/books', {
      title: opts.title,
      priceMinor: opts.priceMinor ?? 1200,
      currency: 'EUR',
      coverColour: 'reed',
    })
    .expect(201);
  const id: string = created.body.book.id;
  let book = created.body.book;
  for (const [name, spec] of opts.drills ?? [
    ['Starter C/D', CD],
    ['Four-three D/C', DC],
  ]) {
    const savedDrillId = await saveDrill(teacher, name, spec, 'chromatic');
    book = (await teacher.post(`/api/books/${id}/drills`, { savedDrillId, note: `Note for ${name}` }).expect(201)).body
      .book;
  }
  if (opts.publish) book = (await teacher.patch(`/api/books/${id}`, { published: true }).expect(200)).body.book;
  return book as { id: string; drills: { id: string; title: string; free: boolean }[] };
}

beforeAll(async () => {
  mara = await createUser(ctx.db, { role: 'teacher', name: 'Mara Quill' });
  teacher = await signedIn(ctx.app, mara);
  player = await signedIn(ctx.app, await createUser(ctx.db, { role: 'player', name: 'Theo Park' }));
  otherTeacher = await signedIn(ctx.app, await createUser(ctx.db, { role: 'teacher' }));
});

describe('teachers make drill books', () => {
  it('creates a draft, adds saved drills with notes, reorders, marks the free drill and publishes', async () => {
    const book = await makeBook({ title: 'Pairs for the Tuesday combo' });
    expect(book.drills.map((d) => d.title)).toEqual(['Starter C/D', 'Four-three D/C']);
    const [first, second] = book.drills;

    const reordered = await teacher.agent
      .put(`/api/books/${book.id}/order`)
      .set('X-CSRF-Token', teacher.csrf)
      .send({ drillIds: [second.id, first.id] })
      .expect(200);
    expect(reordered.body.book.drills.map((d: { id: string }) => d.id)).toEqual([second.id, first.id]);

    const noted = await teacher
      .patch(`/api/books/${book.id}/drills/${first.id}`, { note: 'Sing the top triad.', free: true, keyCycle: null })
      .expect(200);
    const starter = noted.body.book.drills.find((d: { id: string }) => d.id === first.id);
    expect(starter).toMatchObject({ note: 'Sing the top triad.', free: true, keyCycle: null });

    // Marking another drill free moves the mark: one free drill per book.
    const moved = await teacher.patch(`/api/books/${book.id}/drills/${second.id}`, { free: true }).expect(200);
    expect(moved.body.book.drills.filter((d: { free: boolean }) => d.free).map((d: { id: string }) => d.id)).toEqual([
      second.id,
    ]);

    const published = await teacher
      .patch(`/api/books/${book.id}`, { published: true, description: 'For the combo' })
      .expect(200);
    expect(published.body.book).toMatchObject({
      published: true,
      priceMinor: 1200,
      currency: 'EUR',
      coverColour: 'reed',
      access: 'owner',
    });
  });

  it('rejects a reorder that does not name every drill once', async () => {
    const book = await makeBook({ title: 'Order check' });
    const res = await teacher.agent
      .put(`/api/books/${book.id}/order`)
      .set('X-CSRF-Token', teacher.csrf)
      .send({ drillIds: [book.drills[0].id] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.drillIds).toBeDefined();
  });

  it('will not publish an empty book, and frees the first drill when none was chosen', async () => {
    const empty = await teacher.post('/api/books', { title: 'Empty' }).expect(201);
    const res = await teacher.patch(`/api/books/${empty.body.book.id}`, { published: true });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.published).toBeDefined();

    const book = await makeBook({ title: 'Auto free', publish: true });
    expect(book.drills.map((d) => d.free)).toEqual([true, false]);
  });

  it('checks the price, currency and cover colour', async () => {
    for (const [body, field] of [
      [{ title: 'x', priceMinor: -1 }, 'priceMinor'],
      [{ title: 'x', priceMinor: 12.5 }, 'priceMinor'],
      [{ title: 'x', currency: 'XYZ' }, 'currency'],
      [{ title: 'x', coverColour: 'green' }, 'coverColour'],
      [{ title: '' }, 'title'],
    ] as const) {
      const res = await teacher.post('/api/books', body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.body.error.fields[field]).toBeDefined();
    }
  });

  it('lets only teachers make books, and only their own be changed (404 for anyone else’s)', async () => {
    expect((await player.post('/api/books', { title: 'Mine' })).status).toBe(403);
    const book = await makeBook({ title: 'Not yours' });
    expect((await otherTeacher.patch(`/api/books/${book.id}`, { title: 'Taken' })).status).toBe(404);
    expect((await otherTeacher.patch(`/api/books/${book.id}/drills/${book.drills[0].id}`, { note: 'x' })).status).toBe(
      404,
    );
    expect(
      (
        await otherTeacher.agent
          .delete(`/api/books/${book.id}/drills/${book.drills[0].id}`)
          .set('X-CSRF-Token', otherTeacher.csrf)
      ).status,
    ).toBe(404);
    // Another teacher's saved drill cannot be added to one's own book.
    const theirs = await saveDrill(otherTeacher, 'Theirs', DC);
    expect((await teacher.post(`/api/books/${book.id}/drills`, { savedDrillId: theirs })).status).toBe(404);
  });

  it('copies the spec when a drill is added: editing the saved drill later leaves the book alone', async () => {
    const savedDrillId = await saveDrill(teacher, 'Copy check', DC, 'fourths');
    const made = await teacher.post('/api/books', { title: 'Copy check', priceMinor: 0 }).expect(201);
    const added = await teacher.post(`/api/books/${made.body.book.id}/drills`, { savedDrillId, note: '' }).expect(201);
    const drillId = added.body.book.drills[0].id;
    await teacher.patch(`/api/drills/${savedDrillId}`, { spec: BBM }).expect(200);
    const res = await teacher.get(`/api/books/${made.body.book.id}/drills/${drillId}`).expect(200);
    expect(res.body.drill.spec).toEqual(DC);
    expect(res.body.drill.keyCycle).toBe('fourths');
  });

  it('removes a drill; the free mark passes on in a published book', async () => {
    const book = await makeBook({ title: 'Removal', publish: true });
    const res = await teacher.agent
      .delete(`/api/books/${book.id}/drills/${book.drills[0].id}`)
      .set('X-CSRF-Token', teacher.csrf)
      .expect(200);
    expect(res.body.book.drills).toHaveLength(1);
    expect(res.body.book.drills[0].free).toBe(true);
    const last = await teacher.agent
      .delete(`/api/books/${book.id}/drills/${book.drills[1].id}`)
      .set('X-CSRF-Token', teacher.csrf);
    expect(last.status).toBe(400);
  });
});

describe('the catalogue and entitlements', () => {
  let priced: Awaited<ReturnType<typeof makeBook>>;
  let draft: Awaited<ReturnType<typeof makeBook>>;
  let freeBook: Awaited<ReturnType<typeof makeBook>>;

  beforeAll(async () => {
    priced = await makeBook({ title: 'Catalogue priced', publish: true, priceMinor: 1500 });
    draft = await makeBook({ title: 'Catalogue draft' });
    freeBook = await makeBook({ title: 'Catalogue free', publish: true, priceMinor: 0 });
  });

  it('GET /api/books lists published books in the agreed shape, drafts left out', async () => {
    const res = await request(ctx.app).get('/api/books').expect(200);
    const books = res.body.books as {
      id: string;
      title: string;
      priceMinor: number;
      currency: string;
      drills: { id: string; title: string; free: boolean }[];
    }[];
    const mine = books.find((b) => b.id === priced.id)!;
    expect(mine).toMatchObject({ id: priced.id, title: 'Catalogue priced', priceMinor: 1500, currency: 'EUR' });
    expect(mine.drills).toEqual(
      priced.drills.map((d) => expect.objectContaining({ id: d.id, title: d.title, free: d.free })),
    );
    expect(mine.drills.filter((d) => d.free)).toHaveLength(1);
    expect(books.some((b) => b.id === draft.id)).toBe(false);
    // The contents list never carries a drill's spec.
    expect(JSON.stringify(mine.drills)).not.toContain('"spec"');
  });

  it('hides a draft from everyone but its teacher', async () => {
    expect((await player.get(`/api/books/${draft.id}`)).status).toBe(404);
    expect((await player.get(`/api/books/${draft.id}/drills/${draft.drills[0].id}`)).status).toBe(404);
    expect((await teacher.get(`/api/books/${draft.id}`)).status).toBe(200);
    const mine = await teacher.get('/api/books/mine').expect(200);
    expect(mine.body.books.some((b: { id: string }) => b.id === draft.id)).toBe(true);
  });

  it('GET /api/books/:id/drills/:drillId gives the teacher every drill in the agreed shape', async () => {
    for (const d of priced.drills) {
      const res = await teacher.get(`/api/books/${priced.id}/drills/${d.id}`).expect(200);
      expect(Object.keys(res.body.drill).sort()).toEqual(['id', 'keyCycle', 'note', 'spec', 'title']);
      expect(res.body.drill).toMatchObject({ id: d.id, title: d.title, keyCycle: 'chromatic' });
    }
  });

  it('gives a player who has not bought the book the free drill only (404 for the rest)', async () => {
    const free = priced.drills.find((d) => d.free)!;
    const locked = priced.drills.find((d) => !d.free)!;
    expect((await player.get(`/api/books/${priced.id}/drills/${free.id}`)).status).toBe(200);
    const res = await player.get(`/api/books/${priced.id}/drills/${locked.id}`);
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
    expect((await player.get(`/api/books/${priced.id}/edition`)).status).toBe(404);
    const page = await player.get(`/api/books/${priced.id}`).expect(200);
    expect(page.body.book.access).toBe('free-drill-only');
    // Signed out: the same.
    expect((await request(ctx.app).get(`/api/books/${priced.id}/drills/${free.id}`)).status).toBe(200);
    expect((await request(ctx.app).get(`/api/books/${priced.id}/drills/${locked.id}`)).status).toBe(404);
    // A drill of another book, asked for under this one, is not there either.
    expect((await player.get(`/api/books/${priced.id}/drills/${freeBook.drills[0].id}`)).status).toBe(404);
  });

  it('opens every drill of a free book to anyone', async () => {
    for (const d of freeBook.drills)
      expect((await player.get(`/api/books/${freeBook.id}/drills/${d.id}`)).status).toBe(200);
    const edition = await player.get(`/api/books/${freeBook.id}/edition`).expect(200);
    expect(edition.body.drills).toHaveLength(freeBook.drills.length);
    expect((await player.post(`/api/books/${freeBook.id}/checkout`)).status).toBe(400);
  });

  it('answers 404 for ids that are not ids', async () => {
    expect((await player.get('/api/books/not-an-id')).status).toBe(404);
    expect((await player.get(`/api/books/${priced.id}/drills/nope`)).status).toBe(404);
  });

  it('shows sales to teachers only, their own books only', async () => {
    const res = await teacher.get('/api/books/sales').expect(200);
    const row = res.body.books.find((b: { id: string }) => b.id === priced.id);
    expect(row).toMatchObject({ title: 'Catalogue priced', sales: 0, refunds: 0, revenueMinor: 0, currency: 'EUR' });
    const other = await otherTeacher.get('/api/books/sales').expect(200);
    expect(other.body.books.some((b: { id: string }) => b.id === priced.id)).toBe(false);
    expect((await player.get('/api/books/sales')).status).toBe(403);
  });
});

describe('the demo seed', () => {
  it('gives Mara one published, priced book with the SCENARIO drills and the free starter, once', async () => {
    // The seed's own demo account (made here the way the seed makes it, if no other test has).
    await ctx.db
      .insert(users)
      .values({
        email: 'teacher@sixfold.test',
        name: 'Mara Quill',
        role: 'teacher',
        passwordHash: await hashPassword(DEMO_PASSWORD),
      })
      .onConflictDoNothing();
    await seedDemoBooks(ctx.db);
    await seedDemoBooks(ctx.db);
    const [demoMara] = await ctx.db.select().from(users).where(eq(users.email, 'teacher@sixfold.test'));
    const found = await ctx.db
      .select()
      .from(books)
      .where(and(eq(books.teacherId, demoMara.id), eq(books.title, DEMO_BOOK_TITLE)));
    expect(found).toHaveLength(1);
    expect(found[0]).toMatchObject({ published: true, priceMinor: 1200, currency: 'EUR' });
    const drills = await ctx.db
      .select()
      .from(bookDrills)
      .where(eq(bookDrills.bookId, found[0].id))
      .orderBy(bookDrills.position);
    expect(drills.map((d) => d.spec.pair?.join('/'))).toEqual(['C/D', 'D/C', 'Bbm/Ab', 'G/Db', 'A/G']);
    expect(drills.map((d) => d.spec.chord)).toEqual(['Cmaj7#11', 'D7', 'Bbm7', 'G7', 'Em7']);
    expect(drills.filter((d) => d.free).map((d) => d.spec.pair?.join('/'))).toEqual(['C/D']);
    expect(drills[1]).toMatchObject({ keyCycle: 'chromatic' });
    expect(drills[1].spec).toMatchObject({ pattern: 'four-three', tempo: 100 });
    expect(drills[2]).toMatchObject({ keyCycle: 'fourths' });
    const res = await request(ctx.app).get('/api/books').expect(200);
    expect(
      res.body.books.filter(
        (b: { title: string; teacher: { id: string } }) => b.title === DEMO_BOOK_TITLE && b.teacher.id === demoMara.id,
      ),
    ).toHaveLength(1);
  });
});
