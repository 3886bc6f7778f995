/**
 * When a lender share is live, and which scenario versions a lender may therefore read. The
 * scenario and document rules (canSeeScenario, canSeeDocument) take what this module returns.
 */
import type { ShareState } from '../../shared/responses.js';
import { utcDate } from '../../shared/schema/lender.js';
import { listSharesOfLender, type ShareRecord } from '../db/repositories/lender.js';
import type { Executor } from '../db/repositories/farms.js';

export type { ShareState };

/**
 * The state of a share on `now`: revoked wins, then expired (from `expiresOn`, a UTC date, on),
 * then pending until the link is used, else live. Only a live share gives access.
 */
export function shareState(share: Pick<ShareRecord, 'revokedAt' | 'expiresOn' | 'tokenUsedAt'>, now: Date): ShareState {
  if (share.revokedAt) return 'revoked';
  if (utcDate(now) >= share.expiresOn) return 'expired';
  return share.tokenUsedAt ? 'live' : 'pending';
}

/** The live shares this account accepted on this farm, newest first. */
export async function liveSharesOf(db: Executor, farmId: number, userId: number, now = new Date()): Promise<ShareRecord[]> {
  const shares = await listSharesOfLender(db, farmId, userId);
  return shares.filter((share) => shareState(share, now) === 'live');
}

/** Scenario id → the versions of it shared with this account by a live share, highest first. */
export async function lenderGrants(db: Executor, farmId: number, userId: number, now = new Date()): Promise<Map<number, number[]>> {
  const grants = new Map<number, number[]>();
  for (const share of await liveSharesOf(db, farmId, userId, now)) {
    const versions = grants.get(share.scenarioId) ?? [];
    if (!versions.includes(share.version)) versions.push(share.version);
    grants.set(share.scenarioId, versions.sort((a, b) => b - a));
  }
  return grants;
}
