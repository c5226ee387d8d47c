import Stripe from 'stripe';
import type { Env } from '../env';

/** The default port of the local checkout fake (development; tests pick a free one). */
export const FAKE_CHECKOUT_PORT = 4242;

/** Where the SDK sends its calls: the local fake outside production unless told otherwise. */
export function paymentsEndpoint(env: Env): { host?: string; port?: number; protocol?: 'http' | 'https' } {
  const local = env.NODE_ENV !== 'production';
  return {
    host: env.PAYMENTS_API_HOST ?? (local ? '127.0.0.1' : undefined),
    port: env.PAYMENTS_API_PORT ?? (local ? FAKE_CHECKOUT_PORT : undefined),
    protocol: env.PAYMENTS_API_PROTOCOL ?? (local ? 'http' : undefined),
  };
}

const clients = new WeakMap<Env, Stripe>();

/** The payment service's official SDK, one per parsed environment. */
export function paymentsClient(env: Env): Stripe {
  let client = clients.get(env);
  if (!client) {
    const { host, port, protocol } = paymentsEndpoint(env);
    client = new Stripe(env.STRIPE_SECRET_KEY, {
      ...(host ? { host } : {}),
      ...(port !== undefined ? { port } : {}),
      ...(protocol ? { protocol } : {}),
      maxNetworkRetries: 1,
      timeout: 15_000,
      telemetry: false,
    });
    clients.set(env, client);
  }
  return client;
}

/** Checks a webhook's signature and parses it; throws when the signature does not match. */
export function verifyWebhook(env: Env, rawBody: Buffer, signature: string | string[] | undefined): Stripe.Event {
  if (!signature) throw new Error('No signature header');
  return paymentsClient(env).webhooks.constructEvent(rawBody, signature, env.STRIPE_WEBHOOK_SECRET);
}
