/**
 * The lender workbook of one scenario as the caller may see it: members get the latest version,
 * a lender the version shared with them (the scenario rule decides which). The risk sheet is
 * computed here, on the server, from the scenario's own seeded settings, so the bank's file never
 * carries figures a browser sent.
 */
import type ExcelJS from 'exceljs';
import { type MonteCarloResult, runMonteCarlo, sensitivity } from '../../shared/engine/index.js';
import type { Database } from '../db/client.js';
import { findFarm } from '../db/repositories/farms.js';
import type { Actor } from './access.js';
import { notFound } from '../errors.js';
import { buildLenderWorkbook, workbookFileName } from '../workbook/build-workbook.js';
import { recordAudit } from './audit.js';
import { riskInputsHash } from './risk-inputs-hash.js';
import { scenarioQuotes } from './documents.js';
import { readScenarioWhole } from './scenarios.js';

/** Seeded Monte Carlo runs take seconds; the same inputs give the same result, so recent ones are kept. */
const MONTE_CARLO_CACHE_SIZE = 16;
const monteCarloCache = new Map<string, MonteCarloResult>();

function cachedMonteCarlo(scenario: Parameters<typeof runMonteCarlo>[0]): MonteCarloResult {
  const key = riskInputsHash(scenario);
  const hit = monteCarloCache.get(key);
  if (hit) return hit;
  const result = runMonteCarlo(scenario);
  monteCarloCache.set(key, result);
  const oldest = monteCarloCache.keys().next();
  if (monteCarloCache.size > MONTE_CARLO_CACHE_SIZE && !oldest.done) monteCarloCache.delete(oldest.value);
  return result;
}

/** Builds the workbook (not yet written) and its download name; a lender's download is audited. */
export async function lenderWorkbook(
  db: Database,
  actor: Actor,
  scenarioId: number,
  now = new Date(),
): Promise<{ fileName: string; workbook: ExcelJS.Workbook }> {
  const view = await readScenarioWhole(db, actor, scenarioId);
  const farm = await findFarm(db, actor.farmId);
  if (!farm) throw notFound('Farm not found');
  const { scenario, results, version } = view;
  const workbook = await buildLenderWorkbook({
    scenario,
    results,
    farm: { name: farm.name, location: farm.location },
    version: `Version ${version}`,
    preparedBy: view.updatedBy ?? farm.name,
    created: now,
    risk: { sensitivity: sensitivity(scenario), monteCarlo: cachedMonteCarlo(scenario) },
    quotes: await scenarioQuotes(db, actor, scenarioId),
  });
  if (actor.role === 'lender') {
    await recordAudit(db, { farmId: actor.farmId, userId: actor.userId, name: actor.name }, 'workbook.downloaded', `"${scenario.name}" version ${version}`, { scenarioId, version });
  }
  return { fileName: workbookFileName(farm.name, scenario.name, `v${version}`), workbook };
}
