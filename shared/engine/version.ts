/**
 * The engine's version. Results are a pure function of (scenario document, engine), so the
 * server keeps them per scenario version under `resultsCacheKey()` and never evaluates a
 * version twice. Raise ENGINE_VERSION with any change that can move a figure (a formula, a
 * default, a rounding, how Monte Carlo draws are seeded); kept results under the old key are
 * then ignored and recomputed, and kept Monte Carlo runs read as out of date (their hash holds it).
 */
import { CURRENT_SCHEMA_VERSION } from '../schema/stored-scenario';

export const ENGINE_VERSION = 3;

/**
 * The key kept results are filed under: the engine's version and the document format the
 * kept (migrated) document is written in, so a new format also recomputes.
 */
export function resultsCacheKey(engineVersion: number = ENGINE_VERSION, schemaVersion: number = CURRENT_SCHEMA_VERSION): string {
  if (!Number.isInteger(engineVersion) || engineVersion < 1) throw new RangeError(`engineVersion must be a positive whole number (got ${engineVersion})`);
  if (!Number.isInteger(schemaVersion) || schemaVersion < 1) throw new RangeError(`schemaVersion must be a positive whole number (got ${schemaVersion})`);
  return `engine-${engineVersion}.schema-${schemaVersion}`;
}
