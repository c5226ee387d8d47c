import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import express from 'express';
import { apiRouter } from './fake/api';
import { checkoutPageRouter } from './fake/checkout-page';
import { createState, type SentEvent } from './fake/state';
import { createWebhookSender } from './fake/webhooks';

/**
 * A local stand-in for the hosted payment service (development and test only). It answers the
 * few API calls Sixfold's SDK makes (checkout sessions, refunds; `fake/api.ts`), serves a
 * checkout page with Pay and Cancel (`fake/checkout-page.ts`), and on Pay posts a
 * `checkout.session.completed` event to the app's webhook, signed by the SDK's own test signer
 * (`fake/webhooks.ts`). Sessions live in memory (`fake/state.ts`). Nothing leaves the machine
 * and no money moves.
 */

export interface FakeCheckout {
  port: number;
  /** the fake's own address, e.g. http://127.0.0.1:4242 */
  url: string;
  /** where Pay sends the signed event (the app's /api/payments/webhook) */
  setWebhookUrl(url: string): void;
  /** sends a session's completed event again, unchanged (same id), as the real service may */
  resend(sessionId: string): Promise<number>;
  /** the completed event last sent for a session, with its signature header */
  lastEvent(sessionId: string): SentEvent | undefined;
  close(): Promise<void>;
}

export async function startFakeCheckout(opts: {
  port?: number;
  host?: string;
  /** the API key the SDK must send (Bearer); any key when not given */
  secretKey?: string;
  webhookSecret: string;
  webhookUrl?: string;
}): Promise<FakeCheckout> {
  const state = createState();
  const webhooks = createWebhookSender(state, opts.webhookSecret, opts.webhookUrl);

  const app = express();
  app.disable('x-powered-by');
  app.use(express.urlencoded({ extended: true }));
  app.use('/v1', apiRouter(state, opts.secretKey));
  app.use(
    '/pay',
    checkoutPageRouter(state, (sessionId) => webhooks.deliver(sessionId, true)),
  );
  app.get('/favicon.ico', (_req, res) => {
    res.status(204).end();
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
    setWebhookUrl: (url) => webhooks.setUrl(url),
    resend: (sessionId) => webhooks.deliver(sessionId, false),
    lastEvent: (sessionId) => state.events.get(sessionId),
    close: () =>
      new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      }),
  };
}
