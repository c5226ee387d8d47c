import { Router } from 'express';
import type { AppDeps } from '../app';
import { requireRole } from '../middleware/auth';
import { listUsers } from '../services/users/list';

export function adminRouter({ db }: AppDeps) {
  const router = Router();
  router.use(requireRole('admin'));
  router.get('/users', async (_req, res) => {
    res.json({ users: await listUsers(db) });
  });
  return router;
}
