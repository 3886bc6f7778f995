/** Every API router, mounted under /api. A new area adds one line here. */
import { Router } from 'express';
import type { AppDeps } from '../app.js';
import { FARM_MOUNT, farmRouter, requireSignedIn, type FarmRoute } from '../auth/middleware.js';
import { adminRoutes } from './admin.js';
import { authRoutes } from './auth.js';
import { invitationRoutes } from './invitations.js';
import { memberRoutes } from './members.js';
import { outboxRoutes } from './outbox.js';
import { farmListRoutes, farmRoutes } from './farms.js';
import { scenarioRoutes } from './scenarios.js';
import { preferenceRoutes } from './preferences.js';
import { documentRoutes } from './documents.js';
import { milkRecordRoutes } from './milk-records.js';
import { lenderShareLinkRoutes, lenderShareRoutes } from './lender-shares.js';
import { reviewNoteRoutes } from './review-notes.js';
import { auditRoutes } from './audit.js';

/** The routers under /api/farms/:farmId, in the order their routes are matched. */
const FARM_AREAS: readonly ((deps: AppDeps, route: FarmRoute) => void)[] = [
  farmRoutes,
  memberRoutes,
  scenarioRoutes,
  preferenceRoutes,
  documentRoutes,
  milkRecordRoutes,
  lenderShareRoutes,
  reviewNoteRoutes,
  auditRoutes,
];

export function apiRoutes(deps: AppDeps): Router {
  const router = Router();
  router.use('/auth', authRoutes(deps));
  router.use('/invitations', invitationRoutes(deps));
  router.use('/lender-shares', lenderShareLinkRoutes(deps));
  router.use('/admin', adminRoutes(deps));
  if (deps.mailer.outbox) router.use('/dev/outbox', outboxRoutes(deps.mailer.outbox));
  // Every farm area's routes on one router under one mount: a request matches the farm path and
  // checks the session once, instead of once per area it passes on the way to its own.
  const farm = farmRouter(deps.db);
  for (const area of FARM_AREAS) area(deps, farm.route);
  router.use(FARM_MOUNT.replace(/^\/api/, ''), requireSignedIn, farm.router);
  // After the farm routes, which are the most asked for: /farms itself would otherwise be a
  // prefix every farm request passes through.
  router.use('/farms', requireSignedIn, farmListRoutes(deps));
  return router;
}
