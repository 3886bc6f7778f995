/**
 * The key kept results are filed under (shared/engine/version.ts): results are a pure function
 * of the document and the engine, so the key must change with either and with nothing else
 * (common practice for caches of pure functions, no source).
 */
import { describe, expect, it } from 'vitest';
import { splitResults, joinOption } from '../../../shared/engine/result-parts';
import { evaluateScenario } from '../../../shared/engine/evaluate';
import { ENGINE_VERSION, resultsCacheKey } from '../../../shared/engine/version';
import { CURRENT_SCHEMA_VERSION } from '../../../shared/schema/stored-scenario';
import { handScenario } from './hand-scenario';

describe('resultsCacheKey', () => {
  it('is today\'s engine and document format by default', () => {
    expect(resultsCacheKey()).toBe(resultsCacheKey(ENGINE_VERSION, CURRENT_SCHEMA_VERSION));
    expect(resultsCacheKey()).toBe(`engine-${ENGINE_VERSION}.schema-${CURRENT_SCHEMA_VERSION}`);
  });

  it('changes when the engine version changes, and when the document format changes', () => {
    expect(resultsCacheKey(ENGINE_VERSION + 1)).not.toBe(resultsCacheKey());
    expect(resultsCacheKey(ENGINE_VERSION, CURRENT_SCHEMA_VERSION + 1)).not.toBe(resultsCacheKey());
    // engine 1 / schema 12 and engine 11 / schema 2 must not share a key.
    expect(resultsCacheKey(1, 12)).not.toBe(resultsCacheKey(11, 2));
  });

  it('is the same on every call, so one version is kept once', () => {
    expect(resultsCacheKey(3, 2)).toBe(resultsCacheKey(3, 2));
  });

  it('fits the 40-character engine_key column', () => {
    expect(resultsCacheKey(999_999, 999_999).length).toBeLessThanOrEqual(40);
  });

  it('refuses a version that is not a positive whole number', () => {
    expect(() => resultsCacheKey(0)).toThrow(RangeError);
    expect(() => resultsCacheKey(1.5)).toThrow(/engineVersion/);
    expect(() => resultsCacheKey(1, -1)).toThrow(/schemaVersion/);
  });
});

describe('splitResults', () => {
  it('keeps everything: the summary joined with the detail is the whole result', () => {
    const results = evaluateScenario(handScenario());
    const { summary, detail } = splitResults(results);
    expect(summary.options.map((o, i) => joinOption(o, detail[i]!))).toEqual(results.options);
    expect(summary.options.some((o) => 'years' in o || 'payments' in o.loan)).toBe(false);
  });
});
