import { Router } from 'express';
import {
  CreateCustomPatternInput,
  type CustomPatternResponse,
  type CustomPatternsResponse,
  IdParams,
  UpdateCustomPatternInput,
} from '../../shared/schemas/drills';
import type { AppDeps } from '../context';
import { signedIn, requireUser } from '../middleware/auth';
import { parseBody, parseParams } from '../middleware/validate';
import { createCustomPattern } from '../services/patterns/create';
import { deleteCustomPattern } from '../services/patterns/delete';
import { getCustomPattern } from '../services/patterns/get';
import { listCustomPatterns } from '../services/patterns/list';
import { updateCustomPattern } from '../services/patterns/update';

/** The signed-in user's custom patterns (and their studios' teachers', to read). */
export function patternsRouter({ db }: AppDeps) {
  const router = Router();
  router.use(signedIn);
  router.get('/', async (req, res) => {
    res.json({ patterns: await listCustomPatterns(db, requireUser(req)) } satisfies CustomPatternsResponse);
  });
  router.post('/', async (req, res) => {
    const pattern = await createCustomPattern(db, requireUser(req), parseBody(CreateCustomPatternInput, req));
    res.status(201).json({ pattern } satisfies CustomPatternResponse);
  });
  router.get('/:id', async (req, res) => {
    res.json({
      pattern: await getCustomPattern(db, requireUser(req), parseParams(IdParams, req).id),
    } satisfies CustomPatternResponse);
  });
  router.patch('/:id', async (req, res) => {
    const { id } = parseParams(IdParams, req);
    const pattern = await updateCustomPattern(db, requireUser(req), id, parseBody(UpdateCustomPatternInput, req));
    res.json({ pattern } satisfies CustomPatternResponse);
  });
  router.delete('/:id', async (req, res) => {
    await deleteCustomPattern(db, requireUser(req), parseParams(IdParams, req).id);
    res.status(204).end();
  });
  return router;
}
