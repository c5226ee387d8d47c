import { Router } from 'express';
import type { AppContext } from '../app';
import { requireUser } from '../middleware/auth';
import { listNotifications } from '../services/notifications/list';
import { markNotificationsRead } from '../services/notifications/mark-read';

/** What the signed-in user has been told in the app. */
export function notificationsRouter({ db }: AppContext) {
  const router = Router();
  router.use(requireUser);
  router.get('/', async (req, res) => {
    res.json(await listNotifications(db, req.user!.id));
  });
  router.post('/read', async (req, res) => {
    await markNotificationsRead(db, req.user!.id);
    res.json({ ok: true });
  });
  return router;
}
