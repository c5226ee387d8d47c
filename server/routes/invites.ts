import { Router } from 'express';
import type { UserResponse } from '../../shared/schemas/auth';
import {
  type AcceptInviteResponse,
  type InvitePreviewResponse,
  InviteSignUpInput,
  InviteTokenParams,
} from '../../shared/schemas/studios';
import type { AppContext } from '../context';
import { signedIn, requireUser } from '../middleware/auth';
import { csrfTokenFor } from '../middleware/csrf';
import { regenerateSession, saveSession } from '../middleware/session';
import { parseBody, parseParams } from '../middleware/validate';
import { acceptInvite } from '../services/invites/accept';
import { previewInvite } from '../services/invites/preview';
import { signUpThroughInvite } from '../services/invites/sign-up';
import { takeLimit } from '../services/rate-limit/take';
import { signUpLimit } from './auth';

/** The e-mailed invite link: look at it signed out, accept it signed in, or sign up through it. */
export function invitesRouter({ db, env }: AppContext) {
  const router = Router();

  router.get('/:token', async (req, res) => {
    const { token } = parseParams(InviteTokenParams, req);
    res.json({ invite: await previewInvite(db, token) } satisfies InvitePreviewResponse);
  });

  router.post('/:token/accept', signedIn, async (req, res) => {
    const { token } = parseParams(InviteTokenParams, req);
    res.json({ studio: await acceptInvite(db, requireUser(req), token) } satisfies AcceptInviteResponse);
  });

  router.post('/:token/sign-up', async (req, res) => {
    const { token } = parseParams(InviteTokenParams, req);
    const input = parseBody(InviteSignUpInput, req);
    await takeLimit(db, signUpLimit(req, env));
    const user = await signUpThroughInvite(db, token, input);
    // Signed in under a new session id (no fixation), with a new CSRF token.
    await regenerateSession(req);
    req.session.userId = user.id;
    csrfTokenFor(req);
    await saveSession(req);
    res.status(201).json({ user } satisfies UserResponse);
  });

  return router;
}
