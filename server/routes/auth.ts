import { type Request, Router } from 'express';
import type { CsrfResponse, OkResponse, SessionResponse, UserResponse } from '../../shared/schemas/auth';
import {
  ChangePasswordInput,
  PasswordResetConfirmInput,
  PasswordResetInput,
  SignInInput,
  SignUpInput,
  UpdateAccountInput,
} from '../../shared/schemas/auth';
import type { AppContext } from '../context';
import { signedIn, requireUser } from '../middleware/auth';
import { linkOrigin } from '../mail/link-origin';
import { csrfTokenFor, issueCsrfToken } from '../middleware/csrf';
import { destroySession, regenerateSession, SESSION_COOKIE, saveSession } from '../middleware/session';
import { parseBody } from '../middleware/validate';
import { changePassword } from '../services/auth/change-password';
import { confirmPasswordReset } from '../services/auth/confirm-password-reset';
import { requestPasswordReset } from '../services/auth/request-password-reset';
import { signIn } from '../services/auth/sign-in';
import { signUp } from '../services/auth/sign-up';
import { updateAccount } from '../services/auth/update-account';
import { type Limit, takeLimit } from '../services/rate-limit/take';
import type { Env } from '../env';

/** Starts a signed-in session under a new id (no session fixation) with a new CSRF token. */
async function startSession(req: Request, userId: string) {
  await regenerateSession(req);
  req.session.userId = userId;
  csrfTokenFor(req);
  await saveSession(req);
}

/** Reset mails one address may be sent in 15 minutes. */
export const RESET_EMAIL_LIMIT = 3;

/** Sign-ups from one source an hour (plain and through an invite). */
export function signUpLimit(req: Request, env: Env): Limit {
  return {
    key: `sign-up-ip:${req.ip}`,
    max: env.SIGN_UP_IP_LIMIT,
    windowSeconds: 60 * 60,
    message: 'Too many new accounts from here in the last hour',
  };
}

export function authRouter(deps: AppContext) {
  const { db } = deps;
  const router = Router();

  router.get('/csrf', (req, res) => {
    res.json({ token: issueCsrfToken(req, res, deps.env) } satisfies CsrfResponse);
  });

  router.get('/session', (req, res) => {
    res.json({ user: req.user ?? null } satisfies SessionResponse);
  });

  router.get('/me', signedIn, (req, res) => {
    res.json({ user: requireUser(req) } satisfies UserResponse);
  });

  router.post('/sign-up', async (req, res) => {
    const input = parseBody(SignUpInput, req);
    await takeLimit(db, signUpLimit(req, deps.env));
    const user = await signUp(db, input);
    await startSession(req, user.id);
    res.status(201).json({ user } satisfies UserResponse);
  });

  router.post('/sign-in', async (req, res) => {
    const input = parseBody(SignInInput, req);
    const user = await signIn(db, { ...input, ip: req.ip ?? 'unknown' }, { sourceLimit: deps.env.SIGN_IN_IP_LIMIT });
    await startSession(req, user.id);
    res.json({ user } satisfies UserResponse);
  });

  router.post('/sign-out', signedIn, async (req, res) => {
    await destroySession(req);
    res.clearCookie(SESSION_COOKIE, { path: '/', httpOnly: true, sameSite: 'lax' });
    res.json({ ok: true } satisfies OkResponse);
  });

  router.patch('/me', signedIn, async (req, res) => {
    const input = parseBody(UpdateAccountInput, req);
    res.json({ user: await updateAccount(db, requireUser(req).id, input) } satisfies UserResponse);
  });

  router.post('/password', signedIn, async (req, res) => {
    const input = parseBody(ChangePasswordInput, req);
    await changePassword(db, requireUser(req).id, input, req.sessionID);
    res.json({ ok: true } satisfies OkResponse);
  });

  router.post('/password-reset', async (req, res) => {
    const input = parseBody(PasswordResetInput, req);
    await takeLimit(db, {
      key: `reset-ip:${req.ip}`,
      max: deps.env.RESET_IP_LIMIT,
      windowSeconds: 15 * 60,
      message: 'Too many password-reset requests from here',
    });
    // Counted per address whether or not it has an account, so the answer tells nothing.
    await takeLimit(db, {
      key: `reset-email:${input.email}`,
      max: RESET_EMAIL_LIMIT,
      windowSeconds: 15 * 60,
      message: 'A reset link was sent to this address a few times already; check the inbox (and spam folder)',
    });
    // The answer leaves before the account is looked up, so known and unknown addresses take
    // the same time; the lookup and the mail go on in the background.
    requestPasswordReset(db, deps.mailer, { ...input, origin: linkOrigin(req, deps.env) }).catch((err: unknown) => {
      console.error('[mail] password reset failed:', err instanceof Error ? err.message : err);
    });
    res.json({ ok: true } satisfies OkResponse);
  });

  router.post('/password-reset/confirm', async (req, res) => {
    const input = parseBody(PasswordResetConfirmInput, req);
    await confirmPasswordReset(db, input);
    res.json({ ok: true } satisfies OkResponse);
  });

  return router;
}
