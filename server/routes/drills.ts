import { Router } from 'express';
import {
  CreateSavedDrillInput,
  IdParams,
  PreviewQuery,
  type PreviewResponse,
  type SavedDrillResponse,
  type SavedDrillsResponse,
  UpdateSavedDrillInput,
} from '../../shared/schemas/drills';
import type { AppDeps } from '../context';
import { signedIn, requireUser } from '../middleware/auth';
import { parseBody, parseParams, parseQuery } from '../middleware/validate';
import { createSavedDrill } from '../services/drills/create';
import { deleteSavedDrill } from '../services/drills/delete';
import { getSavedDrill } from '../services/drills/get';
import { listSavedDrills } from '../services/drills/list';
import { previewDrill } from '../services/drills/preview';
import { updateSavedDrill } from '../services/drills/update';

/** The drill preview (public: pure computation) and the signed-in user's saved drills. */
export function drillsRouter({ db }: AppDeps) {
  const router = Router();
  router.get('/preview', (req, res) => {
    res.json({ drill: previewDrill(parseQuery(PreviewQuery, req)) } satisfies PreviewResponse);
  });
  router.use(signedIn);
  router.get('/', async (req, res) => {
    res.json({ drills: await listSavedDrills(db, requireUser(req)) } satisfies SavedDrillsResponse);
  });
  router.post('/', async (req, res) => {
    const drill = await createSavedDrill(db, requireUser(req), parseBody(CreateSavedDrillInput, req));
    res.status(201).json({ drill } satisfies SavedDrillResponse);
  });
  router.get('/:id', async (req, res) => {
    res.json({
      drill: await getSavedDrill(db, requireUser(req), parseParams(IdParams, req).id),
    } satisfies SavedDrillResponse);
  });
  router.patch('/:id', async (req, res) => {
    const { id } = parseParams(IdParams, req);
    const drill = await updateSavedDrill(db, requireUser(req), id, parseBody(UpdateSavedDrillInput, req));
    res.json({ drill } satisfies SavedDrillResponse);
  });
  router.delete('/:id', async (req, res) => {
    await deleteSavedDrill(db, requireUser(req), parseParams(IdParams, req).id);
    res.status(204).end();
  });
  return router;
}
