import { count, eq } from 'drizzle-orm';
import request from 'supertest';
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditLog, paymentEvents, purchases } from '../../server/db/schema';
import type { DrillSpec } from '../../shared/schemas/drills';
import { type Client, createUser, signedIn, type TestUser, waitForMail } from '../helpers/factories';
import { startPaymentsFake, startTestServer } from '../helpers/test-server';

const fake = await startPaymentsFake();
const server = await startTestServer({ PAYMENTS_API_PORT: String(fake.port) });
fake.setWebhookUrl(`${server.url}/api/payments/webhook`);
afterAll(async () => {
  await server.stop();
  await fake.close();
});

/** A signature header made by the SDK's own test signer, as the real service would send it. */
const sign = (payload: string, secret: string, timestamp?: number) =>
  Stripe.webhooks.generateTestHeaderString({ payload, secret, timestamp });

const DC: DrillSpec = { pair: ['D', 'C'], pattern: 'four-three', direction: 'up', tempo: 100, chord: 'D7' };
const CD: DrillSpec = { pair: ['C', 'D'], pattern: 'stack', direction: 'up-down', chord: 'Cmaj7#11' };

let teacher: Client;
let admin: Client;
let bookId: string;
let freeDrillId: string;
let lockedDrillId: string;

async function newPlayer(): Promise<{ user: TestUser; c: Client }> {
  const user = await createUser(server.db, { role: 'player', name: 'Theo Park' });
  return { user, c: await signedIn(server.app, user) };
}

/** Opens a checkout as the player; the session id is the last part of the fake's page address. */
async function checkout(c: Client) {
  const res = await c.post(`/api/books/${bookId}/checkout`).expect(200);
  expect(Object.keys(res.body)).toEqual(['url']);
  const url = new URL(res.body.url);
  expect(url.origin).toBe(fake.url);
  return { url: res.body.url as string, sessionId: url.pathname.split('/').pop()! };
}

/** Presses a button of the fake's checkout page, as the browser's form would. */
async function press(sessionId: string, button: 'complete' | 'cancel') {
  const res = await fetch(`${fake.url}/pay/${sessionId}/${button}`, { method: 'POST', redirect: 'manual' });
  expect(res.status).toBe(303);
  // supertest serves the app on a port of its own: compare the path the browser comes back to
  const back = new URL(res.headers.get('location')!);
  return `${back.pathname}${back.search}`;
}

const canOpenLocked = async (c: Client) => (await c.get(`/api/books/${bookId}/drills/${lockedDrillId}`)).status;
const purchaseOf = async (sessionId: string) =>
  (await server.db.select().from(purchases).where(eq(purchases.sessionId, sessionId)))[0];
const eventCount = async () => (await server.db.select({ n: count() }).from(paymentEvents))[0].n;

beforeAll(async () => {
  const mara = await createUser(server.db, { role: 'teacher', name: 'Mara Quill' });
  teacher = await signedIn(server.app, mara);
  admin = await signedIn(server.app, await createUser(server.db, { role: 'admin', name: 'Desk' }));
  const book = await teacher
    .post('/api/books', { title: 'Pairs for the Tuesday combo', priceMinor: 1200, currency: 'EUR' })
    .expect(201);
  bookId = book.body.book.id;
  for (const [name, spec] of [
    ['Starter', CD],
    ['Four-three', DC],
  ] as const) {
    const saved = await teacher.post('/api/drills', { name, spec, keyOrder: 'chromatic' }).expect(201);
    await teacher
      .post(`/api/books/${bookId}/drills`, { savedDrillId: saved.body.drill.id, note: 'Slow first.' })
      .expect(201);
  }
  const published = await teacher.patch(`/api/books/${bookId}`, { published: true }).expect(200);
  freeDrillId = published.body.book.drills[0].id;
  lockedDrillId = published.body.book.drills[1].id;
});

describe('buying a book through the checkout fake', () => {
  it('grants the book on the signed webhook, once even when the event comes twice, and e-mails a receipt', async () => {
    const { user, c } = await newPlayer();
    expect(await canOpenLocked(c)).toBe(404);
    const { url, sessionId } = await checkout(c);
    expect((await purchaseOf(sessionId)).status).toBe('pending');
    // The checkout page shows the price, with Pay and Cancel.
    const page = await (await fetch(url)).text();
    expect(page).toContain('12.00 EUR');
    expect(page).toMatch(/Cancel/);
    // Nothing is granted before the webhook.
    expect(await canOpenLocked(c)).toBe(404);

    const back = await press(sessionId, 'complete');
    expect(back).toBe(`/books/${bookId}?checkout=done`);
    expect(await canOpenLocked(c)).toBe(200);
    const drill = await c.get(`/api/books/${bookId}/drills/${lockedDrillId}`).expect(200);
    expect(drill.body.drill).toMatchObject({
      id: lockedDrillId,
      title: 'Four-three',
      note: 'Slow first.',
      spec: DC,
      keyCycle: 'chromatic',
    });
    const bought = await c.get(`/api/books/${bookId}`).expect(200);
    expect(bought.body.book.access).toBe('bought');
    const paid = await purchaseOf(sessionId);
    expect(paid).toMatchObject({ status: 'paid', amountMinor: 1200, currency: 'EUR', playerId: user.id });
    expect(paid.paymentIntentId).toMatch(/^pi_/);

    const mail = await waitForMail(admin, user.email);
    expect(mail[0].subject).toMatch(/receipt.*Pairs for the Tuesday combo/i);
    expect(mail[0].text).toContain('12.00 EUR');
    expect(mail[0].text).toContain(paid.id);

    // The same event again (same id, freshly signed): answered, nothing more granted or sent.
    const before = await eventCount();
    expect(await fake.resend(sessionId)).toBe(200);
    const event = fake.lastEvent(sessionId)!;
    const again = await request(server.app)
      .post('/api/payments/webhook')
      .set('Content-Type', 'application/json')
      .set('Stripe-Signature', event.signature)
      .send(event.payload);
    expect(again.status).toBe(200);
    expect(again.body.granted).toBe(false);
    expect(await eventCount()).toBe(before);
    const rows = await server.db.select().from(purchases).where(eq(purchases.playerId, user.id));
    expect(rows.filter((r) => r.status === 'paid')).toHaveLength(1);
    await new Promise((r) => setTimeout(r, 300));
    expect(await waitForMail(admin, user.email)).toHaveLength(1);

    // Buying it again is refused.
    expect((await c.post(`/api/books/${bookId}/checkout`)).status).toBe(409);
  });

  it('refuses a forged webhook (bad signature) with 400 and changes nothing', async () => {
    const { c } = await newPlayer();
    const { sessionId } = await checkout(c);
    const session = (await fetch(`${fake.url}/v1/checkout/sessions/${sessionId}`, {
      headers: { Authorization: `Bearer ${server.env.STRIPE_SECRET_KEY}` },
    }).then((r) => r.json())) as Record<string, unknown>;
    const payload = JSON.stringify({
      id: 'evt_forged_1',
      object: 'event',
      type: 'checkout.session.completed',
      data: { object: { ...session, status: 'complete', payment_status: 'paid', payment_intent: 'pi_forged' } },
    });
    const before = await eventCount();
    const post = (signature: string | null, body = payload) => {
      const r = request(server.app).post('/api/payments/webhook').set('Content-Type', 'application/json');
      return (signature === null ? r : r.set('Stripe-Signature', signature)).send(body);
    };
    for (const signature of [
      sign(payload, 'whsec_someone_else'),
      null,
      't=1,v1=deadbeef',
      sign('{"id":"other"}', server.env.STRIPE_WEBHOOK_SECRET),
    ]) {
      const res = await post(signature);
      expect(res.status).toBe(400);
      expect(res.body.error.message).toMatch(/signature/);
    }
    // A real signature that is too old is refused as well (replay).
    const old = await post(sign(payload, server.env.STRIPE_WEBHOOK_SECRET, Math.floor(Date.now() / 1000) - 3600));
    expect(old.status).toBe(400);
    expect(await eventCount()).toBe(before);
    expect((await purchaseOf(sessionId)).status).toBe('pending');
    expect(await canOpenLocked(c)).toBe(404);
  });

  it('does not grant a signed event whose amount differs from the checkout', async () => {
    const { c } = await newPlayer();
    const { sessionId } = await checkout(c);
    const payload = JSON.stringify({
      id: 'evt_cheap_1',
      object: 'event',
      type: 'checkout.session.completed',
      data: {
        object: {
          id: sessionId,
          object: 'checkout.session',
          amount_total: 1,
          currency: 'eur',
          payment_status: 'paid',
          payment_intent: 'pi_x',
          metadata: {},
        },
      },
    });
    const res = await request(server.app)
      .post('/api/payments/webhook')
      .set('Content-Type', 'application/json')
      .set('Stripe-Signature', sign(payload, server.env.STRIPE_WEBHOOK_SECRET))
      .send(payload);
    expect(res.status).toBe(200);
    expect(res.body.granted).toBe(false);
    expect(await canOpenLocked(c)).toBe(404);
  });

  it('grants nothing for a cancelled checkout', async () => {
    const { c } = await newPlayer();
    const { sessionId } = await checkout(c);
    const back = await press(sessionId, 'cancel');
    expect(back).toBe(`/books/${bookId}?checkout=cancelled`);
    expect((await purchaseOf(sessionId)).status).toBe('pending');
    expect(await canOpenLocked(c)).toBe(404);
    expect((await c.get(`/api/books/${bookId}`)).body.book.access).toBe('free-drill-only');
    expect(fake.lastEvent(sessionId)).toBeUndefined();
  });

  it('lets an admin refund: access goes, the audit log says so, a second refund is refused', async () => {
    const { user, c } = await newPlayer();
    const { sessionId } = await checkout(c);
    await press(sessionId, 'complete');
    expect(await canOpenLocked(c)).toBe(200);
    const purchase = await purchaseOf(sessionId);

    expect((await c.post(`/api/admin/purchases/${purchase.id}/refund`)).status).toBe(403);
    expect((await teacher.post(`/api/admin/purchases/${purchase.id}/refund`)).status).toBe(403);
    const list = await admin.get('/api/admin/purchases').expect(200);
    expect(list.body.purchases.find((p: { id: string }) => p.id === purchase.id)).toMatchObject({
      status: 'paid',
      player: { email: user.email },
    });

    const res = await admin.post(`/api/admin/purchases/${purchase.id}/refund`).expect(200);
    expect(res.body.purchase).toMatchObject({ id: purchase.id, status: 'refunded' });
    expect(res.body.purchase.refundedAt).toBeTruthy();
    expect(await canOpenLocked(c)).toBe(404);
    expect((await c.get(`/api/books/${bookId}/edition`)).status).toBe(404);
    expect((await c.get(`/api/books/${bookId}/drills/${freeDrillId}`)).status).toBe(200);

    const [entry] = await server.db.select().from(auditLog).where(eq(auditLog.targetId, user.id));
    expect(entry).toMatchObject({ action: 'purchase.refund' });
    expect(entry.detail).toMatchObject({ purchaseId: purchase.id, bookId, amount: '12.00 EUR' });
    const audit = await admin.get('/api/admin/audit').expect(200);
    expect(
      audit.body.entries.some(
        (e: { action: string; target: { id: string } | null }) =>
          e.action === 'purchase.refund' && e.target?.id === user.id,
      ),
    ).toBe(true);

    expect((await admin.post(`/api/admin/purchases/${purchase.id}/refund`)).status).toBe(409);
    // A refunded player may buy again.
    await checkout(c);
  });

  it('shows the teacher the sales per book and per day', async () => {
    const res = await teacher.get('/api/books/sales').expect(200);
    const row = res.body.books.find((b: { id: string }) => b.id === bookId);
    // Two were paid (one in the first test, one refunded in the last): one sale kept, one refund.
    expect(row).toMatchObject({ sales: 1, refunds: 1, revenueMinor: 1200, currency: 'EUR' });
    const today = new Date().toISOString().slice(0, 10);
    expect(res.body.days).toContainEqual({ day: today, bookId, sales: 1, revenueMinor: 1200 });
  });

  it('refuses checkout to the book’s teacher, signed-out visitors and drafts', async () => {
    expect((await teacher.post(`/api/books/${bookId}/checkout`)).status).toBe(400);
    const { c } = await newPlayer();
    const signedOut = await request(server.app).post(`/api/books/${bookId}/checkout`);
    expect([401, 403]).toContain(signedOut.status);
    const draft = await teacher.post('/api/books', { title: 'Draft', priceMinor: 500 }).expect(201);
    expect((await c.post(`/api/books/${draft.body.book.id}/checkout`)).status).toBe(404);
  });

  it('takes the webhook with no session and no CSRF token, and only as JSON', async () => {
    const res = await request(server.app).post('/api/payments/webhook').set('Content-Type', 'text/plain').send('hello');
    expect(res.status).toBe(400);
  });
});
