import express, { type NextFunction, type Request, type Response, type Router } from 'express';
import { type FakeSession, type FakeState, newId, nowSeconds, publicSession, sessionByIntent } from './state';

/** How long an unpaid session stays open, as on the real service. */
const SESSION_LIFETIME_S = 24 * 3600;

/** A line item as the SDK form-encodes it (numbers arrive as strings). */
interface LineItem {
  quantity?: string;
  price_data?: { currency?: string; unit_amount?: string; product_data?: { name?: string } };
}

/** An error in the service's JSON shape, which the SDK turns into its typed errors. */
function apiError(res: Response, status: number, message: string, code?: string) {
  res.status(status).json({ error: { type: 'invalid_request_error', message, ...(code ? { code } : {}) } });
}

/** The SDK sends its key as a Bearer token; with a `secretKey` given, only that key passes. */
function requireKey(secretKey: string | undefined) {
  return (req: Request, res: Response, next: NextFunction) => {
    const auth = req.get('authorization') ?? '';
    const key = auth.startsWith('Bearer ') ? auth.slice(7) : '';
    if (!key || (secretKey && key !== secretKey)) return apiError(res, 401, 'Invalid API key provided');
    next();
  };
}

function createSession(state: FakeState, req: Request, res: Response) {
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
  const id = newId('cs');
  const now = nowSeconds();
  const session: FakeSession = {
    id,
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
    success_url: String(body.success_url).replace('{CHECKOUT_SESSION_ID}', id),
    cancel_url: String(body.cancel_url).replace('{CHECKOUT_SESSION_ID}', id),
    // The page is served by this same fake, at the address the SDK reached it on.
    url: `${req.protocol}://${req.get('host')}/pay/${id}`,
    created: now,
    expires_at: now + SESSION_LIFETIME_S,
    livemode: false,
    _label: String(items[0]?.price_data?.product_data?.name ?? 'Purchase'),
  };
  state.sessions.set(id, session);
  res.json(publicSession(session));
}

function getSession(state: FakeState, req: Request, res: Response) {
  const id = String(req.params.id);
  const session = state.sessions.get(id);
  if (!session) return apiError(res, 404, `No such checkout.session: '${id}'`, 'resource_missing');
  res.json(publicSession(session));
}

/** A refund is always of the whole payment, and only once. */
function refund(state: FakeState, req: Request, res: Response) {
  const intent = String((req.body as Record<string, unknown>).payment_intent ?? '');
  const session = sessionByIntent(state, intent);
  if (!session) return apiError(res, 404, `No such payment_intent: '${intent}'`, 'resource_missing');
  if (state.refunded.has(intent))
    return apiError(res, 400, `Charge for ${intent} has already been refunded.`, 'charge_already_refunded');
  state.refunded.add(intent);
  res.json({
    id: newId('re'),
    object: 'refund',
    amount: session.amount_total,
    currency: session.currency,
    payment_intent: intent,
    status: 'succeeded',
    created: nowSeconds(),
  });
}

/** The part of the service's API that Sixfold calls through the SDK, under /v1. */
export function apiRouter(state: FakeState, secretKey?: string): Router {
  const router = express.Router();
  const key = requireKey(secretKey);
  router.post('/checkout/sessions', key, (req, res) => createSession(state, req, res));
  router.get('/checkout/sessions/:id', key, (req, res) => getSession(state, req, res));
  router.post('/refunds', key, (req, res) => refund(state, req, res));
  return router;
}
