import { createHmac, randomBytes } from 'node:crypto';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import express, { type Request, type Response } from 'express';
import { escapeHtml } from '../mail/templates/layout';

/**
 * A local stand-in for the hosted payment service (development and test only). It answers the
 * few API calls Sixfold's SDK makes (checkout sessions, refunds), serves a checkout page with
 * Pay and Cancel, and on Pay posts a `checkout.session.completed` event to the app's webhook,
 * signed the way the real service signs: `t=<unix>,v1=<HMAC-SHA256(secret, "<t>.<payload>")>`.
 * Nothing leaves the machine and no money moves.
 */

interface FakeSession {
  id: string;
  object: 'checkout.session';
  amount_subtotal: number;
  amount_total: number;
  currency: string;
  client_reference_id: string | null;
  customer_email: string | null;
  metadata: Record<string, string>;
  mode: string;
  payment_intent: string | null;
  payment_status: 'unpaid' | 'paid';
  status: 'open' | 'complete' | 'expired';
  success_url: string;
  cancel_url: string;
  url: string;
  created: number;
  expires_at: number;
  livemode: false;
  /** what the page shows (the first line item's name) */
  _label: string;
}

export interface FakeCheckout {
  port: number;
  /** the fake's own address, e.g. http://127.0.0.1:4242 */
  url: string;
  /** where Pay sends the signed event (the app's /api/payments/webhook) */
  setWebhookUrl(url: string): void;
  /** sends a session's completed event again, unchanged (same id), as the real service may */
  resend(sessionId: string): Promise<number>;
  /** the completed event last sent for a session, with its signature header */
  lastEvent(sessionId: string): { payload: string; signature: string } | undefined;
  close(): Promise<void>;
}

/** The signature header the real service sends, for a payload at a time (seconds). */
export function signPayload(payload: string, secret: string, timestamp = Math.floor(Date.now() / 1000)): string {
  const v1 = createHmac('sha256', secret).update(`${timestamp}.${payload}`, 'utf8').digest('hex');
  return `t=${timestamp},v1=${v1}`;
}

const id = (prefix: string) => `${prefix}_test_${randomBytes(12).toString('hex')}`;

/** A line item as the SDK form-encodes it (numbers arrive as strings). */
interface LineItem {
  quantity?: string;
  price_data?: { currency?: string; unit_amount?: string; product_data?: { name?: string } };
}

function apiError(res: Response, status: number, message: string, code?: string) {
  res.status(status).json({ error: { type: 'invalid_request_error', message, ...(code ? { code } : {}) } });
}

function page(title: string, body: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>${escapeHtml(title)}</title>
<style>
body{margin:0;min-height:100vh;display:grid;place-items:center;background:#0f1a2f;color:#141b2b;font-family:system-ui,sans-serif}
main{background:#fff;border-radius:14px;padding:28px 32px;max-width:420px;width:calc(100% - 48px);box-shadow:0 12px 40px rgb(0 0 0/.35)}
h1{font-size:20px;margin:0 0 4px} p{margin:6px 0 0;line-height:1.5} .amount{font-size:30px;font-weight:800;margin:18px 0}
.note{font-size:13px;color:#545c6e} .row{display:flex;gap:10px;margin-top:22px}
button{font:inherit;font-weight:700;border-radius:8px;padding:10px 18px;cursor:pointer;border:1px solid #d6d1c5;background:#fff}
button.pay{background:#2f9e5e;color:#fff;border-color:#2f9e5e;flex:1}
button:focus-visible{outline:3px solid #d99a1e;outline-offset:2px}
</style></head><body><main>${body}</main></body></html>`;
}

export async function startFakeCheckout(opts: {
  port?: number;
  host?: string;
  /** the API key the SDK must send (Bearer); any key when not given */
  secretKey?: string;
  webhookSecret: string;
  webhookUrl?: string;
}): Promise<FakeCheckout> {
  const sessions = new Map<string, FakeSession>();
  const events = new Map<string, { payload: string; signature: string }>();
  const refunded = new Set<string>();
  let webhookUrl = opts.webhookUrl ?? '';

  async function deliver(sessionId: string, fresh: boolean): Promise<number> {
    const session = sessions.get(sessionId);
    if (!session) throw new Error(`no such session ${sessionId}`);
    let event = events.get(sessionId);
    if (!event || fresh) {
      const { _label, ...object } = session;
      const payload = JSON.stringify({
        id: id('evt'),
        object: 'event',
        api_version: '2026-10-28.endive',
        created: Math.floor(Date.now() / 1000),
        type: 'checkout.session.completed',
        livemode: false,
        pending_webhooks: 1,
        request: { id: null, idempotency_key: null },
        data: { object },
      });
      event = { payload, signature: '' };
    }
    // Signed at each delivery, as the real service does (the timestamp is the delivery's).
    event.signature = signPayload(event.payload, opts.webhookSecret);
    events.set(sessionId, event);
    if (!webhookUrl) return 0;
    for (let attempt = 0; attempt < 3; attempt++) {
      try {
        const res = await fetch(webhookUrl, {
          method: 'POST',
          headers: { 'content-type': 'application/json', 'stripe-signature': event.signature },
          body: event.payload,
        });
        if (res.status < 500) return res.status;
      } catch {
        // the app may be restarting; try again shortly
      }
      await new Promise((r) => setTimeout(r, 300 * (attempt + 1)));
    }
    console.warn(`[payments fake] could not deliver the event for ${sessionId} to ${webhookUrl}`);
    return 0;
  }

  const app = express();
  app.disable('x-powered-by');
  app.use(express.urlencoded({ extended: true }));

  const requireKey = (req: Request, res: Response): boolean => {
    const auth = req.get('authorization') ?? '';
    const key = auth.startsWith('Bearer ') ? auth.slice(7) : '';
    if (!key || (opts.secretKey && key !== opts.secretKey)) {
      res.status(401).json({ error: { type: 'invalid_request_error', message: 'Invalid API key provided' } });
      return false;
    }
    return true;
  };

  app.post('/v1/checkout/sessions', (req, res) => {
    if (!requireKey(req, res)) return;
    const body = req.body as Record<string, unknown>;
    const items = (Array.isArray(body.line_items) ? body.line_items : []) as LineItem[];
    if (!body.success_url || !body.cancel_url)
      return apiError(res, 400, 'success_url and cancel_url are required', 'parameter_missing');
    if (items.length === 0) return apiError(res, 400, 'line_items is required', 'parameter_missing');
    let total = 0;
    let currency = '';
    for (const item of items) {
      const amount = Number(item.price_data?.unit_amount);
      const quantity = Number(item.quantity ?? 1);
      if (!Number.isInteger(amount) || amount < 0 || !Number.isInteger(quantity))
        return apiError(res, 400, 'Invalid unit_amount or quantity', 'parameter_invalid_integer');
      total += amount * quantity;
      currency = String(item.price_data?.currency ?? '').toLowerCase();
    }
    const sid = id('cs');
    const base = `${req.protocol}://${req.get('host')}`;
    const now = Math.floor(Date.now() / 1000);
    const session: FakeSession = {
      id: sid,
      object: 'checkout.session',
      amount_subtotal: total,
      amount_total: total,
      currency,
      client_reference_id: typeof body.client_reference_id === 'string' ? body.client_reference_id : null,
      customer_email: typeof body.customer_email === 'string' ? body.customer_email : null,
      metadata: (body.metadata ?? {}) as Record<string, string>,
      mode: String(body.mode ?? 'payment'),
      payment_intent: null,
      payment_status: 'unpaid',
      status: 'open',
      success_url: String(body.success_url).replace('{CHECKOUT_SESSION_ID}', sid),
      cancel_url: String(body.cancel_url).replace('{CHECKOUT_SESSION_ID}', sid),
      url: `${base}/pay/${sid}`,
      created: now,
      expires_at: now + 24 * 3600,
      livemode: false,
      _label: String(items[0]?.price_data?.product_data?.name ?? 'Purchase'),
    };
    sessions.set(sid, session);
    const { _label, ...out } = session;
    res.json(out);
  });

  app.get('/v1/checkout/sessions/:id', (req, res) => {
    if (!requireKey(req, res)) return;
    const session = sessions.get(req.params.id);
    if (!session) return apiError(res, 404, `No such checkout.session: '${req.params.id}'`, 'resource_missing');
    const { _label, ...out } = session;
    res.json(out);
  });

  app.post('/v1/refunds', (req, res) => {
    if (!requireKey(req, res)) return;
    const intent = String((req.body as Record<string, unknown>).payment_intent ?? '');
    const session = [...sessions.values()].find((s) => s.payment_intent && s.payment_intent === intent);
    if (!session) return apiError(res, 404, `No such payment_intent: '${intent}'`, 'resource_missing');
    if (refunded.has(intent))
      return apiError(res, 400, `Charge for ${intent} has already been refunded.`, 'charge_already_refunded');
    refunded.add(intent);
    res.json({
      id: id('re'),
      object: 'refund',
      amount: session.amount_total,
      currency: session.currency,
      payment_intent: intent,
      status: 'succeeded',
      created: Math.floor(Date.now() / 1000),
    });
  });

  app.get('/pay/:id', (req, res) => {
    const s = sessions.get(req.params.id);
    if (!s)
      return res
        .status(404)
        .type('html')
        .send(page('Checkout not found', '<h1>This checkout has expired or never existed.</h1>'));
    const amount = `${(s.amount_total / 100).toFixed(2)} ${s.currency.toUpperCase()}`;
    if (s.status !== 'open') {
      return res
        .type('html')
        .send(
          page(
            'Checkout',
            `<h1>This checkout is already ${s.status === 'complete' ? 'paid' : 'closed'}.</h1><p><a href="${escapeHtml(s.success_url)}">Return to the shop</a></p>`,
          ),
        );
    }
    res.type('html').send(
      page(
        'Checkout',
        `<p class="note">Local test checkout: nothing is charged, no card is asked for.</p>
<h1>${escapeHtml(s._label)}</h1>
${s.customer_email ? `<p class="note">Receipt to ${escapeHtml(s.customer_email)}</p>` : ''}
<p class="amount" data-testid="checkout-amount">${escapeHtml(amount)}</p>
<div class="row">
<form method="post" action="/pay/${escapeHtml(s.id)}/cancel"><button type="submit">Cancel</button></form>
<form method="post" action="/pay/${escapeHtml(s.id)}/complete" style="flex:1;display:flex"><button type="submit" class="pay">Pay ${escapeHtml(amount)}</button></form>
</div>`,
      ),
    );
  });

  app.get('/favicon.ico', (_req, res) => {
    res.status(204).end();
  });

  app.post('/pay/:id/complete', async (req, res) => {
    const s = sessions.get(req.params.id);
    if (!s) return res.status(404).type('text').send('No such checkout');
    if (s.status === 'open') {
      s.status = 'complete';
      s.payment_status = 'paid';
      s.payment_intent = id('pi');
      await deliver(s.id, true);
    }
    res.redirect(303, s.success_url);
  });

  app.post('/pay/:id/cancel', (req, res) => {
    const s = sessions.get(req.params.id);
    if (!s) return res.status(404).type('text').send('No such checkout');
    // The real service leaves the session open (it expires later) and sends no completed event.
    res.redirect(303, s.cancel_url);
  });

  const host = opts.host ?? '127.0.0.1';
  const server: Server = await new Promise((resolve, reject) => {
    const s = app.listen(opts.port ?? 0, host);
    s.once('listening', () => resolve(s));
    s.once('error', reject);
  });
  const { port } = server.address() as AddressInfo;
  return {
    port,
    url: `http://${host}:${port}`,
    setWebhookUrl(url) {
      webhookUrl = url;
    },
    resend: (sessionId) => deliver(sessionId, false),
    lastEvent: (sessionId) => events.get(sessionId),
    close: () =>
      new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      }),
  };
}
