import { Router } from 'express';
import type { AssignmentsResponse, AssignmentWeeklyResponse } from '../../shared/schemas/assignments';
import { AssignmentParams, AssignmentWeeklyQuery } from '../../shared/schemas/assignments';
import type { AppContext } from '../context';
import { requireRole, signedIn, requireUser } from '../middleware/auth';
import { parseParams, parseQuery } from '../middleware/validate';
import { deleteAssignment } from '../services/assignments/delete';
import { listMyAssignments } from '../services/assignments/list';
import { assignmentWeekly } from '../services/assignments/weekly';

/** A player's assignments across their studios; a teacher withdraws one. */
export function assignmentsRouter({ db }: AppContext) {
  const router = Router();
  router.use(signedIn);
  router.get('/', requireRole('player'), async (req, res) => {
    res.json({ assignments: await listMyAssignments(db, requireUser(req)) } satisfies AssignmentsResponse);
  });
  router.get('/:id/weekly', async (req, res) => {
    const { id } = parseParams(AssignmentParams, req);
    const { tz } = parseQuery(AssignmentWeeklyQuery, req);
    res.json((await assignmentWeekly(db, requireUser(req), id, tz)) satisfies AssignmentWeeklyResponse);
  });
  router.delete('/:id', async (req, res) => {
    const { id } = parseParams(AssignmentParams, req);
    await deleteAssignment(db, requireUser(req), id);
    res.status(204).end();
  });
  return router;
}
