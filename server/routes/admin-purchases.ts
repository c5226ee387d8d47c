import { Router } from 'express';
import type { AdminPurchaseResponse, AdminPurchasesResponse } from '../../shared/schemas/books';
import { PurchaseParams } from '../../shared/schemas/books';
import type { AppContext } from '../context';
import { requireRole, requireUser } from '../middleware/auth';
import { parseParams } from '../middleware/validate';
import { listPurchases } from '../services/purchases/list';
import { refundPurchase } from '../services/purchases/refund';

/** Drill-book purchases for admins, and refunds (which take the book away and are logged). */
export function adminPurchasesRouter({ db, env }: AppContext) {
  const router = Router();
  router.use(requireRole('admin'));
  router.get('/', async (_req, res) => {
    res.json({ purchases: await listPurchases(db) } satisfies AdminPurchasesResponse);
  });
  router.post('/:id/refund', async (req, res) => {
    const { id } = parseParams(PurchaseParams, req);
    res.json({ purchase: await refundPurchase(db, env, requireUser(req), id) } satisfies AdminPurchaseResponse);
  });
  return router;
}
