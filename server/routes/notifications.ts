import { Router } from 'express';
import type { OkResponse } from '../../shared/schemas/auth';
import type { NotificationsResponse } from '../../shared/schemas/remarks';
import type { AppContext } from '../context';
import { signedIn, requireUser } from '../middleware/auth';
import { listNotifications } from '../services/notifications/list';
import { markNotificationsRead } from '../services/notifications/mark-read';

/** What the signed-in user has been told in the app. */
export function notificationsRouter({ db }: AppContext) {
  const router = Router();
  router.use(signedIn);
  router.get('/', async (req, res) => {
    res.json((await listNotifications(db, requireUser(req).id)) satisfies NotificationsResponse);
  });
  router.post('/read', async (req, res) => {
    await markNotificationsRead(db, requireUser(req).id);
    res.json({ ok: true } satisfies OkResponse);
  });
  return router;
}
