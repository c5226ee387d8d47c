import { Router } from 'express';
import { AssignmentParams } from '../../shared/schemas/assignments';
import type { AppContext } from '../context';
import { requireRole, signedIn, requireUser } from '../middleware/auth';
import { parseParams } from '../middleware/validate';
import { deleteAssignment } from '../services/assignments/delete';
import { listMyAssignments } from '../services/assignments/list';

/** A player's assignments across their studios; a teacher withdraws one. */
export function assignmentsRouter({ db }: AppContext) {
  const router = Router();
  router.use(signedIn);
  router.get('/', requireRole('player'), async (req, res) => {
    res.json({ assignments: await listMyAssignments(db, requireUser(req)) });
  });
  router.delete('/:id', async (req, res) => {
    const { id } = parseParams(AssignmentParams, req);
    await deleteAssignment(db, requireUser(req), id);
    res.status(204).end();
  });
  return router;
}
