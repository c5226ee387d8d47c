import { Router } from 'express';
import { CreateCustomPatternInput, IdParams, UpdateCustomPatternInput } from '../../shared/schemas/drills';
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
    res.json({ patterns: await listCustomPatterns(db, requireUser(req)) });
  });
  router.post('/', async (req, res) => {
    res
      .status(201)
      .json({ pattern: await createCustomPattern(db, requireUser(req), parseBody(CreateCustomPatternInput, req)) });
  });
  router.get('/:id', async (req, res) => {
    res.json({ pattern: await getCustomPattern(db, requireUser(req), parseParams(IdParams, req).id) });
  });
  router.patch('/:id', async (req, res) => {
    const { id } = parseParams(IdParams, req);
    res.json({
      pattern: await updateCustomPattern(db, requireUser(req), id, parseBody(UpdateCustomPatternInput, req)),
    });
  });
  router.delete('/:id', async (req, res) => {
    await deleteCustomPattern(db, requireUser(req), parseParams(IdParams, req).id);
    res.status(204).end();
  });
  return router;
}
