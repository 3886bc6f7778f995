/**
 * The hash a cached Monte Carlo result is kept with: SHA-256 (hex) of the canonical JSON of
 * everything the result depends on — the whole scenario except its name, description and
 * sensitivity ranges, and the engine's version, so a result kept before the engine (its model
 * or how draws are seeded) changed reads as out of date. Canonical JSON sorts object keys, so
 * the same inputs in another key order hash the same.
 */
import { createHash } from 'node:crypto';
import { ENGINE_VERSION } from '../../shared/engine/index.js';
import type { Scenario } from '../../shared/schema/index.js';

/** JSON with object keys sorted at every level (arrays keep their order); undefined members dropped. */
export function canonicalJson(value: unknown): string {
  if (value === null || typeof value !== 'object') return JSON.stringify(value) ?? 'null';
  if (Array.isArray(value)) return `[${value.map((item) => (item === undefined ? 'null' : canonicalJson(item))).join(',')}]`;
  const entries = Object.entries(value as Record<string, unknown>)
    .filter(([, v]) => v !== undefined)
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
}

/** SHA-256 of a UTF-8 string, lowercase hex (64 characters). */
export function sha256Hex(text: string): string {
  return createHash('sha256').update(text, 'utf8').digest('hex');
}

/** Hash of the inputs a Monte Carlo result of this scenario depends on, under engine `engineVersion` (hex SHA-256). */
export function riskInputsHash(scenario: Scenario, engineVersion: number = ENGINE_VERSION): string {
  const { name: _name, description: _description, risk, ...rest } = scenario;
  return sha256Hex(canonicalJson({ ...rest, monteCarlo: risk.monteCarlo, engineVersion }));
}
