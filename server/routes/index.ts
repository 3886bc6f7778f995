/** Every API router, mounted under /api. A new area adds one line here. */
import { Router } from 'express';
import type { AppDeps } from '../app.js';
import { FARM_MOUNT, requireSignedIn } from '../auth/middleware.js';
import { authRoutes } from './auth.js';
import { farmListRoutes, farmRoutes } from './farms.js';

export function apiRoutes(deps: AppDeps): Router {
  const router = Router();
  router.use('/auth', authRoutes(deps));
  router.use('/farms', requireSignedIn, farmListRoutes(deps));
  const farmPath = FARM_MOUNT.replace(/^\/api/, '');
  router.use(farmPath, requireSignedIn, farmRoutes(deps));
  return router;
}
