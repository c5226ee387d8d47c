import { Router } from 'express';
import type {
  AssignmentResponse,
  AssignmentsResponse,
  BoardResponse,
  StudioPlayerResponse,
} from '../../shared/schemas/assignments';
import { CreateAssignmentInput } from '../../shared/schemas/assignments';
import {
  CreateInviteInput,
  CreateStudioInput,
  type InviteResponse,
  type InvitesResponse,
  StudioParams,
  StudioPlayerParams,
  type StudioResponse,
  type StudiosResponse,
} from '../../shared/schemas/studios';
import type { AppContext } from '../context';
import { linkOrigin } from '../mail/link-origin';
import { takeLimit } from '../services/rate-limit/take';
import { requireRole, signedIn, requireUser } from '../middleware/auth';
import { parseBody, parseParams } from '../middleware/validate';
import { createAssignment } from '../services/assignments/create';
import { listStudioAssignments } from '../services/assignments/list';
import { createInvite } from '../services/invites/create';
import { listInvites } from '../services/invites/list';
import { teacherAccess } from '../services/studios/access';
import { getStudioBoard } from '../services/studios/board';
import { createStudio } from '../services/studios/create';
import { getStudio } from '../services/studios/get';
import { leaveStudio } from '../services/studios/leave';
import { listStudios } from '../services/studios/list';
import { getStudioPlayer } from '../services/studios/player-detail';

/**
 * Studios. Someone outside a studio gets 404 on every route under /:id (as for a studio that
 * does not exist); its players get 403 on what only the teacher may do. The teacher check
 * runs before the body is read, so an outsider never learns more from a 400.
 */
export function studiosRouter(deps: AppContext) {
  const { db, env } = deps;
  const router = Router();
  router.use(signedIn);

  router.get('/', async (req, res) => {
    res.json({ studios: await listStudios(db, requireUser(req)) } satisfies StudiosResponse);
  });

  router.post('/', requireRole('teacher'), async (req, res) => {
    const input = parseBody(CreateStudioInput, req);
    res.status(201).json({ studio: await createStudio(db, requireUser(req), input) } satisfies StudioResponse);
  });

  router.get('/:id', async (req, res) => {
    const { id } = parseParams(StudioParams, req);
    res.json({ studio: await getStudio(db, requireUser(req), id) } satisfies StudioResponse);
  });

  router.get('/:id/board', async (req, res) => {
    const { id } = parseParams(StudioParams, req);
    res.json((await getStudioBoard(db, requireUser(req), id)) satisfies BoardResponse);
  });

  router.get('/:id/players/:playerId', async (req, res) => {
    const { id, playerId } = parseParams(StudioPlayerParams, req);
    res.json((await getStudioPlayer(db, requireUser(req), id, playerId)) satisfies StudioPlayerResponse);
  });

  router.delete('/:id/membership', async (req, res) => {
    const { id } = parseParams(StudioParams, req);
    await leaveStudio(db, requireUser(req), id);
    res.status(204).end();
  });

  router.get('/:id/invites', async (req, res) => {
    const { id } = parseParams(StudioParams, req);
    res.json({ invites: await listInvites(db, requireUser(req), id) } satisfies InvitesResponse);
  });

  router.post('/:id/invites', async (req, res) => {
    const { id } = parseParams(StudioParams, req);
    await teacherAccess(db, requireUser(req), id);
    const input = parseBody(CreateInviteInput, req);
    await takeLimit(db, {
      key: `invites:${requireUser(req).id}`,
      max: env.INVITE_LIMIT,
      windowSeconds: 60 * 60,
      message: `You have sent ${env.INVITE_LIMIT} invites in the last hour, the most one teacher may`,
    });
    const invite = await createInvite(db, deps.mailer, requireUser(req), id, {
      ...input,
      origin: linkOrigin(req, env),
    });
    res.status(201).json({ invite } satisfies InviteResponse);
  });

  router.get('/:id/assignments', async (req, res) => {
    const { id } = parseParams(StudioParams, req);
    res.json({ assignments: await listStudioAssignments(db, requireUser(req), id) } satisfies AssignmentsResponse);
  });

  router.post('/:id/assignments', async (req, res) => {
    const { id } = parseParams(StudioParams, req);
    await teacherAccess(db, requireUser(req), id);
    const input = parseBody(CreateAssignmentInput, req);
    res
      .status(201)
      .json({ assignment: await createAssignment(db, requireUser(req), id, input) } satisfies AssignmentResponse);
  });

  return router;
}
