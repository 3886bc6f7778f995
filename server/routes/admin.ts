/** /api/admin: account administration. Administrators see accounts, never farm data. */
import { Router } from 'express';
import { adminUpdateUserSchema } from '../../shared/schema/accounts.js';
import type { AppDeps } from '../app.js';
import { requireAdmin, requireUser } from '../auth/middleware.js';
import { parseOrThrow } from '../errors.js';
import { idParam } from '../http/params.js';
import { listAccounts, setAccountDisabled } from '../services/accounts.js';

export function adminRoutes({ db }: AppDeps): Router {
  const router = Router();
  router.use(requireAdmin);

  router.get('/users', async (_req, res) => {
    const users = await listAccounts(db);
    res.json(users.map(({ id, email, name, isAdmin, disabled, createdAt, farmCount }) => ({ id, email, name, isAdmin, disabled, createdAt, farmCount })));
  });

  router.patch('/users/:userId', async (req, res) => {
    const userId = idParam(req, 'userId', 'User id');
    const { disabled } = parseOrThrow(adminUpdateUserSchema, req.body);
    const user = await setAccountDisabled(db, requireUser(req), userId, disabled);
    res.json({ id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin, disabled: user.disabled });
  });

  return router;
}
