import { Router } from 'express';
import { CreateRemarkInput, TakeRemarksParams } from '../../shared/schemas/remarks';
import type { AppContext } from '../app';
import { linkOrigin } from '../mail/link-origin';
import { requireUser } from '../middleware/auth';
import { parseBody, parseParams } from '../middleware/validate';
import { createRemark } from '../services/remarks/create';
import { listRemarks } from '../services/remarks/list';

/** Remarks on a take, mounted at /api/takes/:takeId/remarks. */
export function remarksRouter(deps: AppContext) {
  const { db, env } = deps;
  const router = Router({ mergeParams: true });
  router.use(requireUser);
  router.get('/', async (req, res) => {
    const { takeId } = parseParams(TakeRemarksParams, req);
    res.json({ remarks: await listRemarks(db, req.user!, takeId) });
  });
  router.post('/', async (req, res) => {
    const { takeId } = parseParams(TakeRemarksParams, req);
    const input = parseBody(CreateRemarkInput, req);
    const remark = await createRemark(db, deps.mailer, req.user!, takeId, { ...input, origin: linkOrigin(req, env) });
    res.status(201).json({ remark });
  });
  return router;
}
