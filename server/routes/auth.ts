import { type Request, Router } from 'express';
import {
  ChangePasswordInput,
  PasswordResetConfirmInput,
  PasswordResetInput,
  SignInInput,
  SignUpInput,
  UpdateAccountInput,
} from '../../shared/schemas/auth';
import type { AppContext } from '../context';
import { requireUser, signedIn } from '../middleware/auth';
import { csrfTokenFor } from '../middleware/csrf';
import { destroySession, regenerateSession, SESSION_COOKIE, saveSession } from '../middleware/session';
import { parseBody } from '../middleware/validate';
import { changePassword } from '../services/auth/change-password';
import { confirmPasswordReset } from '../services/auth/confirm-password-reset';
import { requestPasswordReset } from '../services/auth/request-password-reset';
import { signIn } from '../services/auth/sign-in';
import { signUp } from '../services/auth/sign-up';
import { updateAccount } from '../services/auth/update-account';

/** Where e-mailed links point: PUBLIC_URL, or outside production the address the request came to. */
function linkOrigin(req: Request, deps: AppContext): string | null {
  if (deps.env.PUBLIC_URL) return deps.env.PUBLIC_URL;
  // A Host header is the sender's to choose; in production only PUBLIC_URL is trusted.
  if (deps.env.NODE_ENV === 'production') return null;
  return `${req.protocol}://${req.get('host')}`;
}

/** Starts a signed-in session under a new id (no session fixation) with a new CSRF token. */
async function startSession(req: Request, userId: string) {
  await regenerateSession(req);
  req.session.userId = userId;
  csrfTokenFor(req);
  await saveSession(req);
}

export function authRouter(deps: AppContext) {
  const { db } = deps;
  const router = Router();

  router.get('/csrf', (req, res) => {
    res.json({ token: csrfTokenFor(req) });
  });

  router.get('/session', (req, res) => {
    res.json({ user: req.user ?? null });
  });

  router.get('/me', signedIn, (req, res) => {
    res.json({ user: req.user });
  });

  router.post('/sign-up', async (req, res) => {
    const input = parseBody(SignUpInput, req);
    const user = await signUp(db, input);
    await startSession(req, user.id);
    res.status(201).json({ user });
  });

  router.post('/sign-in', async (req, res) => {
    const input = parseBody(SignInInput, req);
    const user = await signIn(db, { ...input, ip: req.ip ?? 'unknown' }, { ipLimit: deps.env.SIGN_IN_IP_LIMIT });
    await startSession(req, user.id);
    res.json({ user });
  });

  router.post('/sign-out', signedIn, async (req, res) => {
    await destroySession(req);
    res.clearCookie(SESSION_COOKIE, { path: '/', httpOnly: true, sameSite: 'lax' });
    res.json({ ok: true });
  });

  router.patch('/me', signedIn, async (req, res) => {
    const input = parseBody(UpdateAccountInput, req);
    res.json({ user: await updateAccount(db, requireUser(req).id, input) });
  });

  router.post('/password', signedIn, async (req, res) => {
    const input = parseBody(ChangePasswordInput, req);
    await changePassword(db, requireUser(req).id, input, req.sessionID);
    res.json({ ok: true });
  });

  router.post('/password-reset', async (req, res) => {
    const input = parseBody(PasswordResetInput, req);
    await requestPasswordReset(db, deps.mailer, { ...input, origin: linkOrigin(req, deps) });
    res.json({ ok: true });
  });

  router.post('/password-reset/confirm', async (req, res) => {
    const input = parseBody(PasswordResetConfirmInput, req);
    await confirmPasswordReset(db, input);
    res.json({ ok: true });
  });

  return router;
}
