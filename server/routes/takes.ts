import { Router } from 'express';
import { CreateTakeInput, TakeIdParams } from '../../shared/schemas/takes';
import type { AppContext } from '../app';
import { requireRole, requireUser } from '../middleware/auth';
import { parseBody, parseParams } from '../middleware/validate';
import { createTake } from '../services/takes/create';
import { deleteTake } from '../services/takes/delete';
import { exportTakeMidi, takeFileName } from '../services/takes/export-midi';
import { getTake } from '../services/takes/get';
import { presentTake } from '../services/takes/present';

export function takesRouter({ db }: AppContext) {
  const router = Router();

  router.post('/', requireRole('player'), async (req, res) => {
    const input = parseBody(CreateTakeInput, req);
    const { take, created } = await createTake(db, {
      ...input,
      playerId: req.user!.id,
      startedAt: new Date(input.startedAt),
      measures: input.measures ?? null,
    });
    res.status(created ? 201 : 200).json({ take: presentTake(take) });
  });

  router.get('/:id', requireUser, async (req, res) => {
    const { id } = parseParams(TakeIdParams, req);
    res.json({ take: presentTake(await getTake(db, req.user!, id)) });
  });

  router.get('/:id/midi', requireUser, async (req, res) => {
    const { id } = parseParams(TakeIdParams, req);
    const take = await getTake(db, req.user!, id);
    res
      .type('audio/midi')
      .attachment(takeFileName(take))
      .send(Buffer.from(exportTakeMidi(take)));
  });

  router.delete('/:id', requireRole('player'), async (req, res) => {
    const { id } = parseParams(TakeIdParams, req);
    await deleteTake(db, req.user!.id, id);
    res.status(204).end();
  });

  return router;
}
