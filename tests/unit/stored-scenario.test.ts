/**
 * The one reader of stored scenario documents: migrate by schemaVersion, then validate. Expected
 * behaviour from docs/product.md (Bad input: never lost data, a clear error naming the field) and
 * docs/model.md (Validation).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { scenarioSchema } from '../../shared/schema/index.js';
import { CURRENT_SCHEMA_VERSION, readScenarioDocument, StoredScenarioError } from '../../shared/schema/stored-scenario.js';

const demo = JSON.parse(readFileSync('scenarios/cairnbrook-five-systems.json', 'utf8')) as Record<string, unknown>;

describe('readScenarioDocument', () => {
  it('reads a current document as the schema parses it', () => {
    expect(CURRENT_SCHEMA_VERSION).toBe(1);
    expect(readScenarioDocument(demo)).toEqual(scenarioSchema.parse(demo));
  });

  it('fills the defaults a stored document left out, as the schema gives them', () => {
    const { horizonYears: _dropped, ...withoutHorizon } = demo;
    // docs/model.md: the horizon defaults to 20 years.
    expect(readScenarioDocument(withoutHorizon).horizonYears).toBe(20);
  });

  it('refuses a document from a newer format instead of guessing', () => {
    expect(() => readScenarioDocument({ ...demo, schemaVersion: 2 })).toThrow(/schemaVersion 2 is newer/);
  });

  it('refuses a document without a schema version, or one that is not an object', () => {
    const { schemaVersion: _dropped, ...unversioned } = demo;
    expect(() => readScenarioDocument(unversioned)).toThrow(StoredScenarioError);
    expect(() => readScenarioDocument('[]')).toThrow(/not a JSON object/);
  });

  it('names the first bad field of a document that no longer validates', () => {
    const broken = structuredClone(demo) as { options: { lyingHoursPerDay: number }[] };
    broken.options[0]!.lyingHoursPerDay = 30;
    expect(() => readScenarioDocument(broken)).toThrow(/options\.0\.lyingHoursPerDay/);
  });
});
