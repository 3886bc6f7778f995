import { Router } from 'express';
import { createFarmSchema } from '../../shared/schema/accounts.js';
import type { AppDeps } from '../app.js';
import { farmAccess, requireUser, type FarmRoute } from '../auth/middleware.js';
import { parseOrThrow } from '../errors.js';
import { createFarm, farmDetail, farmsOf } from '../services/farms.js';

/** /api/farms: the caller's farms, and creating one. */
export function farmListRoutes({ db }: AppDeps): Router {
  const router = Router();
  router.get('/', async (req, res) => {
    res.json(await farmsOf(db, requireUser(req).id));
  });
  router.post('/', async (req, res) => {
    const user = requireUser(req);
    const input = parseOrThrow(createFarmSchema, req.body);
    res.status(201).json(await createFarm(db, user.id, input));
  });
  return router;
}

/** /api/farms/:farmId */
export function farmRoutes({ db }: AppDeps, route: FarmRoute): void {
  route('get', '/', 'farm:read', async (req, res) => {
    const { farmId, role } = farmAccess(req);
    res.json(await farmDetail(db, farmId, role));
  });
}
