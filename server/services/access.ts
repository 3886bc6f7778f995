/**
 * The one rule for what a farm member may see: which scenarios, which of their versions, which
 * documents. Members of every role but lender see everything on their farm. A lender sees only
 * scenarios with a live share to them (not revoked, not past its end date, link used), only the
 * shared versions, and only documents on those scenarios. `accessOf` loads a lender's live
 * grants itself, so no service has to remember to.
 */
import type { FarmRole } from '../../shared/schema/accounts.js';
import type { Executor } from '../db/repositories/farms.js';
import { findScenarioHead } from '../db/repositories/scenarios.js';
import { notFound } from '../errors.js';
import { lenderGrants } from './lender-access.js';

/** Who is asking (id and name, for audit entries and mails), on which farm, in which role. */
export interface Actor {
  farmId: number;
  role: FarmRole;
  userId: number;
  name: string;
}

/** What one caller may see: everything (grants null), or a lender's shared scenarios → versions, highest first. */
export interface Access {
  readonly role: FarmRole;
  readonly grants: ReadonlyMap<number, readonly number[]> | null;
}

/** The caller's access on `now`; a lender's live shares are read here. */
export async function accessOf(db: Executor, actor: Actor, now = new Date()): Promise<Access> {
  if (actor.role !== 'lender') return { role: actor.role, grants: null };
  return { role: actor.role, grants: await lenderGrants(db, actor.farmId, actor.userId, now) };
}

/** Whether the caller may see this scenario at all. */
export function canSeeScenario(access: Access, scenarioId: number): boolean {
  return access.grants === null || access.grants.has(scenarioId);
}

/** The versions of a scenario the caller may read, highest first; null when every version. */
export function visibleVersions(access: Access, scenarioId: number): readonly number[] | null {
  return access.grants === null ? null : (access.grants.get(scenarioId) ?? []);
}

/** Whether the caller may read this version of the scenario. */
export function canSeeVersion(access: Access, scenarioId: number, version: number): boolean {
  const versions = visibleVersions(access, scenarioId);
  return versions === null || versions.includes(version);
}

/** Whether the caller may see (list, download) a document: a lender only those on a scenario shared with them. */
export function canSeeDocument(access: Access, document: { scenarioId: number | null }): boolean {
  return access.grants === null || (document.scenarioId !== null && access.grants.has(document.scenarioId));
}

/** 404 (as for a scenario that does not exist) unless the caller may see it. */
export function assertScenarioVisible(access: Access, scenarioId: number): void {
  if (!canSeeScenario(access, scenarioId)) throw notFound('Scenario not found');
}

/**
 * The caller's access, after a 404 unless the scenario is on the caller's farm and they may see it:
 * what every route under /scenarios/:scenarioId answers alike, whatever it reads next.
 */
export async function accessToScenario(db: Executor, actor: Actor, scenarioId: number, now = new Date()): Promise<Access> {
  const access = await accessOf(db, actor, now);
  assertScenarioVisible(access, scenarioId);
  if (!(await findScenarioHead(db, actor.farmId, scenarioId))) throw notFound('Scenario not found');
  return access;
}
