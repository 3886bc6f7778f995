/** /api/farms/:farmId/audit-log: the owner's record of shares, notes and status changes. */
import { auditQuerySchema } from '../../shared/schema/lender.js';
import type { AppDeps } from '../app.js';
import { farmAccess, type FarmRoute } from '../auth/middleware.js';
import { parseOrThrow } from '../errors.js';
import { readAuditLog } from '../services/audit.js';

export function auditRoutes({ db }: AppDeps, route: FarmRoute): void {
  route('get', '/audit-log', 'audit:read', async (req, res) => {
    const query = parseOrThrow(auditQuerySchema, req.query);
    res.json(await readAuditLog(db, farmAccess(req).farmId, query.limit, query.before));
  });
}
