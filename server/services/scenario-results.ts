/**
 * Results kept per scenario version. They are a pure function of the version's document and the
 * engine, so each version is evaluated once (at save, or at the first read of a version saved
 * before its results were kept, or under another engine key) and every read after that sends
 * the kept JSON text: no parsing, no validating, no evaluating.
 */
import { evaluateScenario } from '../../shared/engine/evaluate.js';
import { splitResults } from '../../shared/engine/result-parts.js';
import type { ScenarioResults } from '../../shared/engine/results.js';
import { resultsCacheKey } from '../../shared/engine/version.js';
import type { Scenario } from '../../shared/schema/index.js';
import { findKeptResults, keepResults, type KeptResults } from '../db/repositories/scenario-results.js';
import { findVersion, type Executor } from '../db/repositories/scenarios.js';
import { notFound } from '../errors.js';

let evaluations = 0;

/** Scenarios this process has evaluated for keeping: a read of kept results adds none (the API tests count on it). */
export function keptEvaluationCount(): number {
  return evaluations;
}

/** Evaluates a validated document (counted). */
export function evaluateForKeeping(document: Scenario): ScenarioResults {
  evaluations += 1;
  return evaluateScenario(document);
}

/** Keeps `results` of `document` as scenario `scenarioId` version `version`, under today's engine key. */
export async function keep(db: Executor, scenarioId: number, version: number, document: Scenario, results: ScenarioResults): Promise<KeptResults> {
  const { summary, detail } = splitResults(results);
  const kept: KeptResults = { name: document.name, document: JSON.stringify(document), summary: JSON.stringify(summary), detail: JSON.stringify(detail) };
  await keepResults(db, { ...kept, scenarioId, version, engineKey: resultsCacheKey() });
  return kept;
}

/** The kept texts of one version (only `columns`), evaluated and kept first when missing; 404 for a version that does not exist. */
export async function keptResults<K extends keyof KeptResults>(db: Executor, scenarioId: number, version: number, columns: readonly K[]): Promise<Pick<KeptResults, K>> {
  const found = await findKeptResults(db, scenarioId, version, resultsCacheKey(), columns);
  if (found) return found;
  const stored = await findVersion(db, scenarioId, version);
  if (!stored) throw notFound(`Version ${version} not found`);
  return keep(db, scenarioId, version, stored.document, evaluateForKeeping(stored.document));
}

/** The kept document of one version, parsed (it was validated before it was kept). */
export async function keptDocument(db: Executor, scenarioId: number, version: number): Promise<Scenario> {
  return JSON.parse((await keptResults(db, scenarioId, version, ['document'])).document) as Scenario;
}
