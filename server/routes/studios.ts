import { Router } from 'express';
import { StudioParams } from '../../shared/schemas/studios';
import type { AppDeps } from '../app';
import { requireUser } from '../middleware/auth';
import { parseParams } from '../middleware/validate';
import { getStudio } from '../services/studios/get';
import { listStudios } from '../services/studios/list';

export function studiosRouter({ db }: AppDeps) {
  const router = Router();
  router.use(requireUser);
  router.get('/', async (req, res) => {
    res.json({ studios: await listStudios(db, req.user!) });
  });
  router.get('/:id', async (req, res) => {
    const { id } = parseParams(StudioParams, req);
    res.json({ studio: await getStudio(db, req.user!, id) });
  });
  return router;
}
