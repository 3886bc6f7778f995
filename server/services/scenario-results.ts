/**
 * Results kept per scenario version. They are a pure function of the version's document and the
 * engine, so each version is evaluated once (at save, or at the first read of a version saved
 * before its results were kept, or under another engine key) and every read after that sends
 * the kept JSON text: no parsing, no validating, no evaluating. A save keeps the summary; the
 * yearly lines and loan payments stay in this process's memory and are written at the first read
 * of them that misses it (after a restart, or in another process), evaluated again then.
 */
import { evaluateScenario, splitResults, type ScenarioResults, resultsCacheKey } from '../../shared/engine/index.js';
import type { Scenario } from '../../shared/schema/index.js';
import { findKeptResults, keepDetail, keepResults, keepSavedResults, type KeptResults } from '../db/repositories/scenario-results.js';
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

/** The texts kept of a version's results, with its document as `documentText`. */
function textsOf(document: Scenario, documentText: string, results: ScenarioResults): KeptResults & { detail: string } {
  const { summary, detail } = splitResults(results);
  return { name: document.name, document: documentText, summary: JSON.stringify(summary), detail: JSON.stringify(detail) };
}

/** Keeps `results` of `document` as scenario `scenarioId` version `version` (a version read back), whole, under today's engine key. */
export async function keep(db: Executor, scenarioId: number, version: number, document: Scenario, results: ScenarioResults): Promise<KeptResults & { detail: string }> {
  const kept = textsOf(document, JSON.stringify(document), results);
  await keepResults(db, { ...kept, scenarioId, version, engineKey: resultsCacheKey() });
  return kept;
}

/**
 * Keeps the results of the version the scenario row holds, written in this same transaction from
 * `documentText` (keepSavedResults); returns the texts whole, to remember once committed.
 */
export async function keepSaved(tx: Executor, scenarioId: number, document: Scenario, documentText: string, results: ScenarioResults): Promise<KeptResults> {
  const kept = textsOf(document, documentText, results);
  await keepSavedResults(tx, scenarioId, resultsCacheKey(), kept.summary);
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

const VIEW_COLUMNS = ['name', 'document', 'summary'] as const;

/** A version's document and summary texts, as committed; evaluated and kept first when missing; 404 for a version that does not exist. */
export async function keptResults(db: Executor, scenarioId: number, version: number): Promise<Omit<KeptResults, 'detail'>> {
  const remembered = rememberedIn(db);
  const key = `${scenarioId}:${version}`;
  const known = remembered.get(key);
  if (known) return remember(remembered, key, known);
  const found = await findKeptResults(db, scenarioId, version, resultsCacheKey(), VIEW_COLUMNS);
  if (found) return remember(remembered, key, { ...found, detail: null });
  return remember(remembered, key, await keepWhole(db, scenarioId, version));
}

/** A version's yearly lines and loan payments as JSON text, evaluated and kept at the first read that finds them missing. */
export async function keptDetail(db: Executor, scenarioId: number, version: number): Promise<string> {
  const remembered = rememberedIn(db);
  const key = `${scenarioId}:${version}`;
  const known = remembered.get(key);
  if (known?.detail) {
    remember(remembered, key, known);
    return known.detail;
  }
  const found = await findKeptResults(db, scenarioId, version, resultsCacheKey(), [...VIEW_COLUMNS, 'detail']);
  if (!found) {
    const whole = await keepWhole(db, scenarioId, version);
    remember(remembered, key, whole);
    return whole.detail;
  }
  let detail = found.detail;
  if (detail === null) {
    detail = JSON.stringify(splitResults(evaluateForKeeping(await storedDocument(db, scenarioId, version))).detail);
    await keepDetail(db, scenarioId, version, resultsCacheKey(), detail);
  }
  remember(remembered, key, { ...found, detail });
  return detail;
}

async function storedDocument(db: Executor, scenarioId: number, version: number): Promise<Scenario> {
  const stored = await findVersion(db, scenarioId, version);
  if (!stored) throw notFound(`Version ${version} not found`);
  return stored.document;
}

/** Evaluates a stored version kept under no (or another) engine key, and keeps its results whole. */
async function keepWhole(db: Executor, scenarioId: number, version: number): Promise<KeptResults & { detail: string }> {
  const document = await storedDocument(db, scenarioId, version);
  return keep(db, scenarioId, version, document, evaluateForKeeping(document));
}
