/** Every API router, mounted under /api. A new area adds one line here. */
import { Router } from 'express';
import type { AppDeps } from '../app.js';
import { FARM_MOUNT, requireSignedIn } from '../auth/middleware.js';
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

export function apiRoutes(deps: AppDeps): Router {
  const router = Router();
  router.use('/auth', authRoutes(deps));
  router.use('/invitations', invitationRoutes(deps));
  router.use('/lender-shares', lenderShareLinkRoutes(deps));
  router.use('/admin', adminRoutes(deps));
  if (deps.mailer.outbox) router.use('/dev/outbox', outboxRoutes(deps.mailer.outbox));
  router.use('/farms', requireSignedIn, farmListRoutes(deps));
  const farmPath = FARM_MOUNT.replace(/^\/api/, '');
  router.use(farmPath, requireSignedIn, farmRoutes(deps));
  router.use(farmPath, requireSignedIn, memberRoutes(deps));
  router.use(farmPath, requireSignedIn, scenarioRoutes(deps));
  router.use(farmPath, requireSignedIn, preferenceRoutes(deps));
  router.use(farmPath, requireSignedIn, documentRoutes(deps));
  router.use(farmPath, requireSignedIn, milkRecordRoutes(deps));
  router.use(farmPath, requireSignedIn, lenderShareRoutes(deps));
  router.use(farmPath, requireSignedIn, reviewNoteRoutes(deps));
  router.use(farmPath, requireSignedIn, auditRoutes(deps));
  return router;
}
