import Stripe from 'stripe';
import { type FakeState, newId, nowSeconds, publicSession, type SentEvent } from './state';

/** The API version the fake's events claim to come from. */
const API_VERSION = '2026-10-28.endive';
/** Deliveries tried before giving up, and the pause before each retry grows by this much. */
const ATTEMPTS = 3;
const BACKOFF_MS = 300;

export interface WebhookSender {
  /** where events go (the app's /api/payments/webhook); nothing is sent while empty */
  setUrl(url: string): void;
  /**
   * Sends a session's `checkout.session.completed` event and answers the app's status (0 when
   * it could not be reached). `fresh` makes a new event; otherwise the last one goes again with
   * the same id, as the real service may send an event more than once.
   */
  deliver(sessionId: string, fresh: boolean): Promise<number>;
}

function completedEvent(state: FakeState, sessionId: string): string {
  const session = state.sessions.get(sessionId);
  if (!session) throw new Error(`no such session ${sessionId}`);
  return JSON.stringify({
    id: newId('evt'),
    object: 'event',
    api_version: API_VERSION,
    created: nowSeconds(),
    type: 'checkout.session.completed',
    livemode: false,
    pending_webhooks: 1,
    request: { id: null, idempotency_key: null },
    data: { object: publicSession(session) },
  });
}

async function post(url: string, event: SentEvent): Promise<number> {
  for (let attempt = 0; attempt < ATTEMPTS; attempt++) {
    try {
      const res = await fetch(url, {
        method: 'POST',
        headers: { 'content-type': 'application/json', 'stripe-signature': event.signature },
        body: event.payload,
      });
      if (res.status < 500) return res.status;
    } catch {
      // the app may be restarting; try again shortly
    }
    await new Promise((r) => setTimeout(r, BACKOFF_MS * (attempt + 1)));
  }
  return 0;
}

export function createWebhookSender(state: FakeState, secret: string, initialUrl = ''): WebhookSender {
  let url = initialUrl;
  return {
    setUrl(next) {
      url = next;
    },
    async deliver(sessionId, fresh) {
      if (!state.sessions.has(sessionId)) throw new Error(`no such session ${sessionId}`);
      const previous = state.events.get(sessionId);
      const payload = !previous || fresh ? completedEvent(state, sessionId) : previous.payload;
      // Signed anew at each delivery, as the real service does: the timestamp is the delivery's.
      // The SDK's own test signer makes the header, so it matches what its verifier expects.
      const event: SentEvent = { payload, signature: Stripe.webhooks.generateTestHeaderString({ payload, secret }) };
      state.events.set(sessionId, event);
      if (!url) return 0;
      const status = await post(url, event);
      if (status === 0) console.warn(`[payments fake] could not deliver the event for ${sessionId} to ${url}`);
      return status;
    },
  };
}
