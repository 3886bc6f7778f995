/**
 * The authorization layer. `loadSession` runs on every request; farm routes are declared with
 * `farmRoute`, which records the route's permission (the API tests generate their role matrix
 * from that record) and checks the caller's membership and role before the handler runs.
 */
import { Router, type NextFunction, type Request, type RequestHandler, type Response } from 'express';
import type { Database } from '../db/client.js';
import type { FarmRole } from '../db/schema/index.js';
import type { ScenarioHead } from '../db/repositories/scenarios.js';
import { findMembership, findUserById, findUserWithScenario, type User } from '../db/repositories/users.js';
import { forbidden, notFound, unauthorized } from '../errors.js';
import { idParam } from '../http/params.js';
import { roleAllows, type Permission } from '../../shared/permissions.js';
import { clearSession, issueSession, readSession, SESSION_LIFETIME_SECONDS } from './session.js';

declare module 'express-serve-static-core' {
  interface Request {
    user?: User;
    farmAccess?: { farmId: number; role: FarmRole };
    /** The caller's role on the farm the path names, read with the session (null: not a member). */
    sessionMembership?: { farmId: number; role: FarmRole | null };
    /** On a GET of a scenario path: that scenario's head, read with the session (null: none on the farm, or not a member). */
    sessionScenario?: { scenarioId: number; head: ScenarioHead | null };
  }
}

/** The farm id a farm route's path starts with, and the scenario id after it on a scenario route. */
const FARM_PATH = /^\/api\/farms\/(\d{1,9})(?:\/scenarios\/(\d{1,9}))?(?:\/|$)/;

interface SessionRows {
  user: User;
  membership: { farmId: number; role: FarmRole | null };
  scenario?: { scenarioId: number; head: ScenarioHead | null };
}

/** The user, their role on the farm and, on a GET of a scenario path, the scenario's head: one round trip. */
async function findSessionRows(db: Database, userId: number, farmId: number, scenarioId: number): Promise<SessionRows | null> {
  const found = await findUserWithScenario(db, userId, farmId, scenarioId > 0 ? scenarioId : 0);
  if (!found) return null;
  return { user: found.user, membership: { farmId, role: found.role }, ...(scenarioId > 0 ? { scenario: { scenarioId, head: found.scenario } } : {}) };
}

export function loadSession(db: Database, secret: string): RequestHandler {
  return async (req, res, next) => {
    const claims = readSession(req, secret);
    if (!claims) return next();
    const userId = Number(claims.sub);
    // On a farm route the membership (and on a scenario read the scenario's head) comes in the
    // same query as the user: one round trip for the whole read.
    const match = FARM_PATH.exec(req.path);
    const farmId = Number(match?.[1] ?? Number.NaN);
    const scenarioId = req.method === 'GET' ? Number(match?.[2] ?? Number.NaN) : Number.NaN;
    let user: User | null;
    if (farmId > 0) {
      const found = await findSessionRows(db, userId, farmId, scenarioId);
      user = found?.user ?? null;
      req.sessionMembership = found?.membership;
      req.sessionScenario = found?.scenario;
    } else {
      user = await findUserById(db, userId);
    }
    if (!user || user.disabled || user.tokenVersion !== claims.ver) {
      req.sessionMembership = undefined;
      req.sessionScenario = undefined;
      clearSession(res);
      return next();
    }
    req.user = user;
    const now = Math.floor(Date.now() / 1000);
    if (claims.exp - now < SESSION_LIFETIME_SECONDS / 2) issueSession(res, req, secret, user.id, user.tokenVersion);
    next();
  };
}

/** The head of `scenarioId` as read with the session, if it was (`{ head: null }`: no such scenario on the farm). */
export function sessionScenarioHead(req: Request, scenarioId: number): { head: ScenarioHead | null } | undefined {
  const known = req.sessionScenario;
  return known?.scenarioId === scenarioId && req.farmAccess?.farmId === req.sessionMembership?.farmId ? known : undefined;
}

export function requireUser(req: Request): User {
  if (!req.user) throw unauthorized();
  return req.user;
}

export const requireSignedIn: RequestHandler = (req, _res, next) => {
  requireUser(req);
  next();
};

export const requireAdmin: RequestHandler = (req, _res, next) => {
  if (!requireUser(req).isAdmin) throw forbidden('Administrators only');
  next();
};

/** Checks that the caller is a member of :farmId whose role allows `permission`. */
export function authorizeFarm(db: Database, permission: Permission): RequestHandler {
  return async (req, _res, next) => {
    const user = requireUser(req);
    const farmId = idParam(req, 'farmId', 'Farm id');
    // A farm the caller does not belong to is "not found", so ids reveal nothing.
    const known = req.sessionMembership;
    const role = known?.farmId === farmId ? known.role : await findMembership(db, farmId, user.id);
    if (!role) throw notFound('Farm not found');
    if (!roleAllows(role, permission)) throw forbidden(`Your role (${role}) cannot do this on this farm`);
    req.farmAccess = { farmId, role };
    next();
  };
}

export function farmAccess(req: Request): { farmId: number; role: FarmRole } {
  if (!req.farmAccess) throw new Error('farm route without authorizeFarm');
  return req.farmAccess;
}

type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

export const FARM_MOUNT = '/api/farms/:farmId';

export interface FarmRouteRecord {
  method: Method;
  /** Full path, e.g. `/api/farms/:farmId/scenarios`. */
  path: string;
  permission: Permission;
}

/** Every farm route declared in this process, for the permission-matrix tests. */
export const farmRouteRegistry: FarmRouteRecord[] = [];

type Handler = (req: Request, res: Response, next: NextFunction) => unknown;

/** Declares one farm route, guarded by a permission and recorded in the registry; extra handlers (e.g. an upload parser) run after the check. */
export type FarmRoute = (method: Method, path: string, permission: Permission, ...handlers: Handler[]) => void;

/**
 * The one router for routes under /api/farms/:farmId, and `route`, which declares one on it. Every
 * farm area declares its routes on the same router, so a request is matched against one list
 * (a router passed through without a match costs a turn of the event loop).
 */
export function farmRouter(db: Database): { router: Router; route: FarmRoute } {
  const router = Router({ mergeParams: true });
  const route: FarmRoute = (method, path, permission, ...handlers) => {
    const fullPath = `${FARM_MOUNT}${path}`.replace(/\/$/, "");
    if (!farmRouteRegistry.some((r) => r.method === method && r.path === fullPath)) {
      farmRouteRegistry.push({ method, path: fullPath, permission });
    }
    router[method](path, authorizeFarm(db, permission), ...(handlers as RequestHandler[]));
  };
  return { router, route };
}
