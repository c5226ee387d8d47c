import { randomBytes } from 'node:crypto';

/** A checkout session as the fake keeps it: the service's fields plus what the page shows. */
export interface FakeSession {
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

/** A session as the API answers it: without the fake's own fields. */
export type PublicSession = Omit<FakeSession, '_label'>;

/** A completed event as it was last sent, with the signature header of that delivery. */
export interface SentEvent {
  payload: string;
  signature: string;
}

/**
 * Everything one fake remembers, in memory only: its sessions by id, the completed event last
 * sent for each session, and the payment intents already refunded.
 */
export interface FakeState {
  sessions: Map<string, FakeSession>;
  events: Map<string, SentEvent>;
  refunded: Set<string>;
}

export function createState(): FakeState {
  return { sessions: new Map(), events: new Map(), refunded: new Set() };
}

/** A fresh test-mode id with the service's prefix for its kind, e.g. `cs_test_…`. */
export const newId = (prefix: string) => `${prefix}_test_${randomBytes(12).toString('hex')}`;

/** Seconds since the epoch, the unit the service uses for every time. */
export const nowSeconds = () => Math.floor(Date.now() / 1000);

export function publicSession(session: FakeSession): PublicSession {
  const { _label, ...out } = session;
  return out;
}

/** The session that a payment intent paid for, if any. */
export function sessionByIntent(state: FakeState, intent: string): FakeSession | undefined {
  if (!intent) return undefined;
  return [...state.sessions.values()].find((s) => s.payment_intent === intent);
}
