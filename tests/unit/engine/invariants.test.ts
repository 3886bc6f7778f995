import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { evaluateNpvOnly, evaluateScenario } from '../../../shared/engine/evaluate';
import { scenarioSchema } from '../../../shared/schema';
import { parseGenerated, scenarioInputArbitrary } from './arbitraries';

function numbersIn(value: unknown, path: string, found: { path: string; value: number }[]): void {
  if (typeof value === 'number') found.push({ path, value });
  else if (Array.isArray(value)) value.forEach((item, i) => numbersIn(item, `${path}[${i}]`, found));
  else if (value && typeof value === 'object') for (const [key, item] of Object.entries(value)) numbersIn(item, `${path}.${key}`, found);
}

// Properties of the model itself (docs/model.md "Validation": never NaN/Infinity; identity; monotonicity).
// Property runs evaluate whole scenarios; allow for a busy machine.
const SLOW = 120_000;

describe('model invariants', () => {
  it('never returns NaN or Infinity for any valid input', () => {
    fc.assert(
      fc.property(scenarioInputArbitrary, (input) => {
        const scenario = parseGenerated(input);
        fc.pre(scenario !== null);
        if (!scenario) return;
        const found: { path: string; value: number }[] = [];
        numbersIn(evaluateScenario(scenario), 'results', found);
        numbersIn(evaluateNpvOnly(scenario, { incrementalIrr: true }), 'fast', found);
        expect(found.filter((n) => !Number.isFinite(n.value))).toEqual([]);
      }),
      { numRuns: 30 },
    );
  }, SLOW);

  it('gives zero incremental flows and NPV for an option identical to the current one', () => {
    fc.assert(
      fc.property(scenarioInputArbitrary, (input) => {
        const [first] = input.options;
        fc.pre(first !== undefined);
        if (!first) return;
        const base = { ...first, herdChange: { cowsByYear: null, addedCows: 0, addedCowCost: null } };
        const scenario = parseGenerated({ ...input, options: [base, { ...base, id: 'copy', current: false }] });
        fc.pre(scenario !== null);
        if (!scenario) return;
        const copy = evaluateScenario(scenario).options[1];
        expect(copy?.incremental?.cashFlows.every((cf) => cf === 0)).toBe(true);
        expect(copy?.incremental?.npv).toBe(0);
        expect(evaluateNpvOnly(scenario)[1]?.incrementalNpv).toBe(0);
      }),
      { numRuns: 30 },
    );
  }, SLOW);

  it('never lowers an option’s NPV when the milk price rises', () => {
    fc.assert(
      fc.property(scenarioInputArbitrary, fc.double({ min: 0.01, max: 1, noNaN: true }), (input, rise) => {
        const low = parseGenerated(input);
        fc.pre(low !== null);
        if (!low) return;
        const high = scenarioSchema.parse({ ...input, herd: { ...input.herd, milkPricePerKg: low.herd.milkPricePerKg * (1 + rise) + 0.01 } });
        const before = evaluateScenario(low).options;
        const after = evaluateScenario(high).options;
        before.forEach((option, i) => {
          // Cents rounding of the lines may move NPV by a few cents at most.
          expect(after[i]?.npv ?? -Infinity).toBeGreaterThanOrEqual(option.npv - 0.05);
        });
      }),
      { numRuns: 30 },
    );
  }, SLOW);

  it('keeps the fast path within 0.01 of the full evaluation', () => {
    fc.assert(
      fc.property(scenarioInputArbitrary, (input) => {
        const scenario = parseGenerated(input);
        fc.pre(scenario !== null);
        if (!scenario) return;
        const full = evaluateScenario(scenario).options;
        const fast = evaluateNpvOnly(scenario);
        full.forEach((option, i) => {
          expect(Math.abs((fast[i]?.npv ?? NaN) - option.npv)).toBeLessThanOrEqual(0.01);
          if (option.incremental) expect(Math.abs((fast[i]?.incrementalNpv ?? NaN) - option.incremental.npv)).toBeLessThanOrEqual(0.01);
        });
      }),
      { numRuns: 30 },
    );
  }, SLOW);
});
