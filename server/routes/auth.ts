import { Router } from 'express';
import {
  changePasswordSchema,
  passwordResetRequestSchema,
  passwordResetSchema,
  signInSchema,
  signUpSchema,
  updateProfileSchema,
} from '../../shared/schema/accounts.js';
import type { AppDeps } from '../app.js';
import { requireUser } from '../auth/middleware.js';
import { attemptLimits } from '../auth/rate-limit.js';
import { clearSession, issueSession } from '../auth/session.js';
import { parseOrThrow } from '../errors.js';
import { changePassword, endAllSessions, signUp, updateProfile, verifyCredentials } from '../services/accounts.js';
import { completePasswordReset, requestPasswordReset } from '../services/password-reset.js';
import { publicUser, sessionOf, sessionOfUser } from '../services/session.js';

export const RESET_REQUESTED_MESSAGE = 'If an account exists for that address, we have sent it a link to set a new password.';

export function authRoutes({ db, config, mailer, logger }: AppDeps): Router {
  const router = Router();
  // Made per app, so each test app (and each server) counts on its own.
  const signInLimits = attemptLimits(config.rateLimit, { countFailuresOnly: true });
  const resetLimits = attemptLimits(config.rateLimit, { countFailuresOnly: false });

  router.post('/sign-up', async (req, res) => {
    const input = parseOrThrow(signUpSchema, req.body);
    const user = await signUp(db, input, config.bcryptCost);
    issueSession(res, req, config.jwtSecret, user.id, user.tokenVersion);
    res.status(201).json({ user: publicUser(user), memberships: [] });
  });

  router.post('/sign-in', ...signInLimits, async (req, res) => {
    const { email, password } = parseOrThrow(signInSchema, req.body);
    const user = await verifyCredentials(db, email, password, config.bcryptCost);
    issueSession(res, req, config.jwtSecret, user.id, user.tokenVersion);
    res.json(await sessionOf(db, user));
  });

  router.post('/sign-out', async (req, res) => {
    if (req.user) await endAllSessions(db, req.user.id);
    clearSession(res);
    res.status(204).end();
  });

  // Signed out (no cookie, or one that no longer counts) is an answer, not an error: null.
  router.get('/me', async (req, res) => {
    if (!req.user) {
      res.json(null);
      return;
    }
    res.json(await sessionOfUser(db, req.user.id));
  });

  router.patch('/me', async (req, res) => {
    const { name } = parseOrThrow(updateProfileSchema, req.body);
    const user = await updateProfile(db, requireUser(req).id, name);
    res.json(await sessionOf(db, user));
  });

  router.post('/me/password', async (req, res) => {
    const input = parseOrThrow(changePasswordSchema, req.body);
    const user = await changePassword(db, requireUser(req), input, config.bcryptCost);
    // Every other session ended with the version bump; this one carries on with a fresh cookie.
    issueSession(res, req, config.jwtSecret, user.id, user.tokenVersion);
    res.status(204).end();
  });

  router.post('/password-reset/request', ...resetLimits, (req, res) => {
    const { email } = parseOrThrow(passwordResetRequestSchema, req.body);
    // Answered before the lookup and the mail, so the reply and its timing are the same for
    // an address with or without an account.
    requestPasswordReset(db, mailer, config.appOrigin, email).catch((err: unknown) => logger.error({ err }, 'password reset mail failed'));
    res.status(202).json({ message: RESET_REQUESTED_MESSAGE });
  });

  router.post('/password-reset/complete', async (req, res) => {
    const input = parseOrThrow(passwordResetSchema, req.body);
    await completePasswordReset(db, input, config.bcryptCost);
    clearSession(res);
    res.status(204).end();
  });

  return router;
}
