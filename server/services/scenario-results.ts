/**
 * Results kept per scenario version. They are a pure function of the version's document and the
 * engine, so each version is evaluated once (at save, or at the first read of a version saved
 * before its results were kept, or under another engine key) and every read after that sends
 * the kept JSON text: no parsing, no validating, no evaluating.
 */
import { evaluateScenario, splitResults, type ScenarioResults, resultsCacheKey } from '../../shared/engine/index.js';
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

/**
 * Keeps `results` of `document` as scenario `scenarioId` version `version`, under today's engine
 * key; `newVersion` when the version is written in the same transaction (nothing older to drop).
 */
export async function keep(db: Executor, scenarioId: number, version: number, document: Scenario, results: ScenarioResults, newVersion = false): Promise<KeptResults> {
  const { summary, detail } = splitResults(results);
  const kept: KeptResults = { name: document.name, document: JSON.stringify(document), summary: JSON.stringify(summary), detail: JSON.stringify(detail) };
  await keepResults(db, { ...kept, scenarioId, version, engineKey: resultsCacheKey() }, newVersion);
  return kept;
}

/**
 * Kept texts read lately, per database handle, by scenario id and version (about 0.3 MB each). A
 * version's texts never change under one engine key, so they can be remembered; only texts of
 * committed versions go in (a save's own `keep` may still be rolled back).
 */
const REMEMBERED = 48;
let rememberedBy = new WeakMap<Executor, Map<string, KeptResults>>();

function rememberedIn(db: Executor): Map<string, KeptResults> {
  let map = rememberedBy.get(db);
  if (!map) {
    map = new Map();
    rememberedBy.set(db, map);
  }
  return map;
}

function remember(remembered: Map<string, KeptResults>, key: string, kept: KeptResults): KeptResults {
  remembered.delete(key);
  if (remembered.size >= REMEMBERED) remembered.delete(remembered.keys().next().value as string);
  remembered.set(key, kept);
  return kept;
}

/** Remembers the texts a save kept, once its transaction has committed, so the answer to the save reads none back. */
export function rememberCommitted(db: Executor, scenarioId: number, version: number, kept: KeptResults): void {
  remember(rememberedIn(db), `${scenarioId}:${version}`, kept);
}

/** Forgets every remembered text: for tests that change kept rows in the database behind the service's back. */
export function forgetRememberedResults(): void {
  rememberedBy = new WeakMap();
}

const ALL_COLUMNS = ['name', 'document', 'summary', 'detail'] as const;

/** The kept texts of one committed version, evaluated and kept first when missing; 404 for a version that does not exist. */
export async function keptResults(db: Executor, scenarioId: number, version: number): Promise<KeptResults> {
  const remembered = rememberedIn(db);
  const key = `${scenarioId}:${version}`;
  const known = remembered.get(key);
  if (known) return remember(remembered, key, known);
  const found = await findKeptResults(db, scenarioId, version, resultsCacheKey(), ALL_COLUMNS);
  if (found) return remember(remembered, key, found);
  const stored = await findVersion(db, scenarioId, version);
  if (!stored) throw notFound(`Version ${version} not found`);
  return remember(remembered, key, await keep(db, scenarioId, version, stored.document, evaluateForKeeping(stored.document)));
}

