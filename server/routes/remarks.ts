import { Router } from 'express';
import {
  CreateRemarkInput,
  type RemarkResponse,
  type RemarksResponse,
  TakeRemarksParams,
} from '../../shared/schemas/remarks';
import type { AppContext } from '../context';
import { linkOrigin } from '../mail/link-origin';
import { signedIn, requireUser } from '../middleware/auth';
import { parseBody, parseParams } from '../middleware/validate';
import { createRemark } from '../services/remarks/create';
import { listRemarks } from '../services/remarks/list';

/** Remarks on a take, mounted at /api/takes/:takeId/remarks. */
export function remarksRouter(deps: AppContext) {
  const { db, env } = deps;
  const router = Router({ mergeParams: true });
  router.use(signedIn);
  router.get('/', async (req, res) => {
    const { takeId } = parseParams(TakeRemarksParams, req);
    res.json({ remarks: await listRemarks(db, requireUser(req), takeId) } satisfies RemarksResponse);
  });
  router.post('/', async (req, res) => {
    const { takeId } = parseParams(TakeRemarksParams, req);
    const input = parseBody(CreateRemarkInput, req);
    const remark = await createRemark(db, deps.mailer, requireUser(req), takeId, {
      ...input,
      origin: linkOrigin(req, env),
    });
    res.status(201).json({ remark } satisfies RemarkResponse);
  });
  return router;
}
