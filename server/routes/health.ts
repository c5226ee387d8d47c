import { Router } from 'express';
import type { HealthResponse } from '../../shared/schemas/health';
import type { AppDeps } from '../context';
import { checkDatabase } from '../services/health/check-database';

export function healthRouter({ pool }: AppDeps) {
  const router = Router();
  router.get('/', async (_req, res) => {
    const up = await checkDatabase(pool);
    res.status(up ? 200 : 503).json({ ok: up, db: up ? 'up' : 'down' } satisfies HealthResponse);
  });
  return router;
}
