import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import connectPgSimple from 'connect-pg-simple';
import express from 'express';
import session from 'express-session';
import type pg from 'pg';
import type { Db } from './db/client';
import type { Env } from './env';
import { errorHandler, notFoundApi } from './middleware/error-handler';
import { healthRouter } from './routes/health';

export interface AppDeps {
  db: Db;
  pool: pg.Pool;
  env: Env;
}

const clientDir = fileURLToPath(new URL('../dist/client', import.meta.url));

/** The Express app: API under /api, the built client for everything else. */
export function createApp(deps: AppDeps) {
  const { env, pool } = deps;
  const app = express();
  app.disable('x-powered-by');
  if (env.TRUST_PROXY === '1') app.set('trust proxy', 1);

  const PgStore = connectPgSimple(session);
  app.use(
    '/api',
    session({
      store: new PgStore({ pool, tableName: 'session', createTableIfMissing: false }),
      name: 'sixfold.sid',
      secret: env.SESSION_SECRET,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: {
        httpOnly: true,
        sameSite: 'lax',
        // Secure whenever the request came over HTTPS (directly or through a trusted proxy).
        secure: 'auto',
        maxAge: 1000 * 60 * 60 * 24 * 14,
      },
    }),
  );
  app.use('/api', express.json({ limit: '2mb' }));

  app.use('/api/health', healthRouter(deps));
  app.use('/api', notFoundApi);

  if (existsSync(clientDir)) {
    app.use(express.static(clientDir, { index: false, maxAge: '1h' }));
    app.get('/{*splat}', (_req, res) => res.sendFile(join(clientDir, 'index.html')));
  }
  app.use(errorHandler);
  return app;
}
