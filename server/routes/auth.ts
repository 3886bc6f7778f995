import { Router } from 'express';
import { signInSchema, signUpSchema } from '../../shared/schema/accounts.js';
import type { AppDeps } from '../app.js';
import { requireUser } from '../auth/middleware.js';
import { clearSession, issueSession } from '../auth/session.js';
import { listMemberships, findUserById } from '../db/repositories/users.js';
import { parseOrThrow } from '../errors.js';
import { endAllSessions, signUp, verifyCredentials } from '../services/accounts.js';

export function authRoutes({ db, config }: AppDeps): Router {
  const router = Router();

  router.post('/sign-up', async (req, res) => {
    const input = parseOrThrow(signUpSchema, req.body);
    const user = await signUp(db, input, config.bcryptCost);
    issueSession(res, req, config.jwtSecret, user.id, user.tokenVersion);
    res.status(201).json({ user: publicUser(user), memberships: [] });
  });

  router.post('/sign-in', async (req, res) => {
    const { email, password } = parseOrThrow(signInSchema, req.body);
    const user = await verifyCredentials(db, email, password);
    issueSession(res, req, config.jwtSecret, user.id, user.tokenVersion);
    res.json({ user: publicUser(user), memberships: await listMemberships(db, user.id) });
  });

  router.post('/sign-out', async (req, res) => {
    if (req.user) await endAllSessions(db, req.user.id);
    clearSession(res);
    res.status(204).end();
  });

  router.get('/me', async (req, res) => {
    const user = await findUserById(db, requireUser(req).id);
    if (!user) throw new Error('signed-in user missing');
    res.json({ user: publicUser(user), memberships: await listMemberships(db, user.id) });
  });

  return router;
}

export function publicUser(user: { id: number; email: string; name: string; isAdmin: boolean }) {
  return { id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin };
}
