import { Router } from 'express';
import { createFarmSchema } from '../../shared/schema/accounts.js';
import type { AppDeps } from '../app.js';
import { farmAccess, farmRouter, requireUser } from '../auth/middleware.js';
import { roleAllows } from '../auth/permissions.js';
import { findFarm, insertFarmWithOwner, listFarmsOfUser } from '../db/repositories/farms.js';
import { notFound, parseOrThrow } from '../errors.js';

/** /api/farms: the caller's farms, and creating one. */
export function farmListRoutes({ db }: AppDeps): Router {
  const router = Router();
  router.get('/', async (req, res) => {
    const farms = await listFarmsOfUser(db, requireUser(req).id);
    res.json(farms.map(({ id, name, location, role, currency, units }) => ({ id, name, location, role, currency, units })));
  });
  router.post('/', async (req, res) => {
    const user = requireUser(req);
    const input = parseOrThrow(createFarmSchema, req.body);
    const id = await insertFarmWithOwner(db, input, user.id);
    res.status(201).json({ id, ...input, role: 'owner' });
  });
  return router;
}

/** /api/farms/:farmId */
export function farmRoutes({ db }: AppDeps): Router {
  const { router, route } = farmRouter(db);
  route('get', '/', 'farm:read', async (req, res) => {
    const { farmId, role } = farmAccess(req);
    const farm = await findFarm(db, farmId);
    if (!farm) throw notFound('Farm not found');
    // A lender sees the farm's name, not its herd baseline.
    res.json({ ...farm, baseline: roleAllows(role, 'baseline:read') ? farm.baseline : null, role });
  });
  return router;
}
