import { Router } from 'express';
import { OutboxQuery, type OutboxResponse } from '../../shared/schemas/dev';
import type { AppDeps } from '../context';
import { requireRole } from '../middleware/auth';
import { parseQuery } from '../middleware/validate';
import { listOutbox } from '../services/dev/list-outbox';

/** Development and test only (never mounted in production): what the fake SMTP server received. */
export function devRouter({ db }: AppDeps) {
  const router = Router();
  router.use(requireRole('admin'));
  router.get('/outbox', async (req, res) => {
    const { to } = parseQuery(OutboxQuery, req);
    res.json({ messages: await listOutbox(db, { to }) } satisfies OutboxResponse);
  });
  return router;
}
