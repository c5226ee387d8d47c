import type { RequestHandler } from 'express';
import type { PaymentWebhookResponse } from '../../shared/schemas/books';
import type { AppContext } from '../context';
import { AppError } from '../errors';
import { linkOrigin } from '../mail/link-origin';
import { verifyWebhook } from '../payments/client';
import { completeCheckout } from '../services/purchases/complete-checkout';

/**
 * `POST /api/payments/webhook`, mounted with express.raw before the JSON parser: the signature
 * is checked over the exact bytes sent. No session and no CSRF token; the signature is the proof.
 * A bad signature is a 400 and nothing is read or written.
 */
export function paymentsWebhook({ db, env, mailer }: AppContext): RequestHandler {
  return async (req, res) => {
    const raw = Buffer.isBuffer(req.body) ? req.body : null;
    if (!raw) throw new AppError('bad_request', 'Send the event as application/json');
    let event: ReturnType<typeof verifyWebhook>;
    try {
      event = verifyWebhook(env, raw, req.get('stripe-signature'));
    } catch {
      throw new AppError('bad_request', 'The webhook signature does not match');
    }
    const granted = await completeCheckout(db, mailer, linkOrigin(req, env), event);
    res.json({ received: true, granted } satisfies PaymentWebhookResponse);
  };
}
