import { Router } from 'express';
import type { AppContext } from '../context';
import { signedIn, requireUser } from '../middleware/auth';
import { listNotifications } from '../services/notifications/list';
import { markNotificationsRead } from '../services/notifications/mark-read';

/** What the signed-in user has been told in the app. */
export function notificationsRouter({ db }: AppContext) {
  const router = Router();
  router.use(signedIn);
  router.get('/', async (req, res) => {
    res.json(await listNotifications(db, requireUser(req).id));
  });
  router.post('/read', async (req, res) => {
    await markNotificationsRead(db, requireUser(req).id);
    res.json({ ok: true });
  });
  return router;
}
