import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { sensitivityInputKeys } from '../../../shared/schema/risk-keys';
import { evaluateNpvOnly } from '../../../shared/engine/evaluate';
import { perturb } from '../../../shared/engine/risk/perturb';
import { sensitivity, type InputSwing } from '../../../shared/engine/risk/sensitivity';
import { riskScenario } from '../engine/fixtures';

const isSortedBySwing = (swings: readonly InputSwing[]): boolean => swings.every((s, i) => i === 0 || (swings[i - 1]?.swing ?? Infinity) >= s.swing);

describe('sensitivity', () => {
  const scenario = riskScenario();
  const result = sensitivity(scenario);

  it('moves each key input by the default ±20 % (docs/model.md, Risk)', () => {
    for (const option of result.options) {
      expect(option.npv.map((s) => s.key).sort()).toEqual([...sensitivityInputKeys].sort());
      for (const swing of option.npv) {
        expect(swing.lowMultiplier).toBeCloseTo(0.8, 12);
        expect(swing.highMultiplier).toBeCloseTo(1.2, 12);
      }
    }
  });

  it('sorts every list by swing, largest first (docs/model.md, Risk)', () => {
    for (const option of result.options) {
      expect(isSortedBySwing(option.npv)).toBe(true);
      if (option.incrementalNpv) expect(isSortedBySwing(option.incrementalNpv)).toBe(true);
    }
  });

  it('reports the NPV of the scenario moved one input at a time, and the swing between them', () => {
    // Definition of one-at-a-time sensitivity: the input at its low/high value, all others at base.
    const steel = result.options.find((o) => o.optionId === 'steel');
    const milk = steel?.npv.find((s) => s.key === 'milkPrice');
    const low = evaluateNpvOnly(perturb(scenario, 'milkPrice', 0.8)).find((o) => o.id === 'steel');
    const high = evaluateNpvOnly(perturb(scenario, 'milkPrice', 1.2)).find((o) => o.id === 'steel');
    expect(milk?.atLow).toBe(low?.npv);
    expect(milk?.atHigh).toBe(high?.npv);
    expect(milk?.swing).toBeCloseTo(Math.abs((high?.npv ?? 0) - (low?.npv ?? 0)), 6);
    const incremental = steel?.incrementalNpv?.find((s) => s.key === 'milkPrice');
    expect(incremental?.atHigh).toBe(high?.incrementalNpv);
  });

  it('gives the current option no incremental view and every candidate one', () => {
    for (const option of result.options) {
      expect(option.incrementalNpv === null).toBe(option.current);
      expect(option.baseIncrementalNpv === null).toBe(option.current);
    }
  });

  it('uses a range passed in instead of the scenario\'s', () => {
    const custom = sensitivity(scenario, { milkPrice: { low: -0.1, high: 0.05 } });
    const milk = custom.options[0]?.npv.find((s) => s.key === 'milkPrice');
    expect(milk?.lowMultiplier).toBeCloseTo(0.9, 12);
    expect(milk?.highMultiplier).toBeCloseTo(1.05, 12);
  });

  it('never lowers any option\'s NPV when the milk price multiplier rises', () => {
    // Milk income is price × kg sold with every other line unchanged, so NPV is non-decreasing
    // in the milk price (definition of NPV, docs/model.md Conventions).
    fc.assert(
      fc.property(fc.double({ min: 0.3, max: 2, noNaN: true }), fc.double({ min: 0.3, max: 2, noNaN: true }), (a, b) => {
        const lower = evaluateNpvOnly(perturb(scenario, 'milkPrice', Math.min(a, b)));
        const higher = evaluateNpvOnly(perturb(scenario, 'milkPrice', Math.max(a, b)));
        lower.forEach((option, i) => expect(higher[i]?.npv ?? -Infinity).toBeGreaterThanOrEqual(option.npv - 1e-6));
      }),
      { numRuns: 25 },
    );
  });
});

describe('the lying-time milk in the sensitivity', () => {
  // The cap raised to a full day so no option's lying time reaches it.
  const base = riskScenario();
  const scenario = { ...base, herd: { ...base.herd, lyingResponseCapHours: 24 } };

  it('moves the NPV the same whether the response or the hours gained are scaled, so it is listed once', () => {
    // The lying effect is response × (hours − current hours) (docs/model.md, Milk): scaling either
    // factor by m scales the product by m, while no option reaches the lying-time cap.
    for (const m of [0.8, 1.2]) {
      const byResponse = evaluateNpvOnly(perturb(scenario, 'yieldResponse', m));
      const byGain = evaluateNpvOnly(perturb(scenario, 'lyingHours', m));
      byResponse.forEach((option, i) => expect(byGain[i]?.incrementalNpv ?? 0).toBeCloseTo(option.incrementalNpv ?? 0, 6));
    }
    const listed = sensitivity(base).options.flatMap((option) => option.npv.map((s) => s.key));
    expect(listed).toContain('yieldResponse');
    expect(listed).not.toContain('lyingHours');
  });
});
