import { existsSync } from 'node:fs';
import { join } from 'node:path';
import express from 'express';
import type { AppContext, AppDeps } from './context';
import { mailerFromEnv } from './mail/mailer';
import { loadUser } from './middleware/auth';
import { cleanInput } from './middleware/clean-input';
import { requireCsrf } from './middleware/csrf';
import { errorHandler, notFoundApi } from './middleware/error-handler';
import { requestLogger, warnOfUntrustedProxy } from './middleware/request-log';
import { securityHeaders } from './middleware/security-headers';
import { sessionMiddleware } from './middleware/session';
import { clientDir as clientDirFromEnv } from './paths';
import { adminRouter } from './routes/admin';
import { adminPurchasesRouter } from './routes/admin-purchases';
import { assignmentsRouter } from './routes/assignments';
import { authRouter } from './routes/auth';
import { booksRouter } from './routes/books';
import { devRouter } from './routes/dev';
import { drillsRouter } from './routes/drills';
import { healthRouter } from './routes/health';
import { invitesRouter } from './routes/invites';
import { notificationsRouter } from './routes/notifications';
import { mapsRouter } from './routes/maps';
import { patternsRouter } from './routes/patterns';
import { paymentsWebhook } from './routes/payments';
import { remarksRouter } from './routes/remarks';
import { studiosRouter } from './routes/studios';
import { practiceRouter } from './routes/practice';
import { settingsRouter } from './routes/settings';
import { takesRouter } from './routes/takes';

export type { AppContext, AppDeps } from './context';

/** The Express app: API under /api, the built client for everything else. */
export function createApp(deps: AppDeps) {
  const ctx: AppContext = { ...deps, mailer: deps.mailer ?? mailerFromEnv(deps.env) };
  const { env, pool, db } = ctx;
  const clientDir = clientDirFromEnv();
  const app = express();
  app.disable('x-powered-by');
  if (env.TRUST_PROXY === '1') app.set('trust proxy', 1);
  else app.use(warnOfUntrustedProxy);
  app.use(requestLogger(env, deps.logStream));
  app.use(securityHeaders(env, clientDir));

  // Raw bytes for the signature check, before the JSON parser; no session, no CSRF token.
  app.post('/api/payments/webhook', express.raw({ type: 'application/json', limit: '1mb' }), paymentsWebhook(ctx));
  app.use('/api', sessionMiddleware(env, pool));
  app.use('/api', express.json({ limit: '2mb' }));
  app.use('/api', cleanInput);
  app.use('/api', requireCsrf(env));
  app.use('/api', loadUser(db));

  app.use('/api/health', healthRouter(ctx));
  app.use('/api/auth', authRouter(ctx));
  app.use('/api/admin/purchases', adminPurchasesRouter(ctx));
  app.use('/api/admin', adminRouter(ctx));
  app.use('/api/books', booksRouter(ctx));
  app.use('/api/studios', studiosRouter(ctx));
  app.use('/api/invites', invitesRouter(ctx));
  app.use('/api/assignments', assignmentsRouter(ctx));
  app.use('/api/notifications', notificationsRouter(ctx));
  app.use('/api/takes/:takeId/remarks', remarksRouter(ctx));
  app.use('/api/takes', takesRouter(ctx));
  app.use('/api/maps', mapsRouter(ctx));
  app.use('/api/settings', settingsRouter(ctx));
  app.use('/api/practice', practiceRouter(ctx));
  app.use('/api/drills', drillsRouter(ctx));
  app.use('/api/patterns', patternsRouter(ctx));
  if (env.NODE_ENV !== 'production') app.use('/api/dev', devRouter(ctx));
  app.use('/api', notFoundApi);

  if (existsSync(clientDir)) {
    app.use(express.static(clientDir, { index: false, maxAge: '1h' }));
    app.get('/{*splat}', (_req, res) => res.sendFile(join(clientDir, 'index.html')));
  }
  app.use(errorHandler);
  return app;
}
