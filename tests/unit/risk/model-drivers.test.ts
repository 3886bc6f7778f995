import { describe, expect, it } from 'vitest';
import type { Scenario } from '../../../shared/schema';
import { evaluateNpvOnly, evaluateScenario } from '../../../shared/engine/evaluate';
import { perturb } from '../../../shared/engine/risk/perturb';
import { sensitivity } from '../../../shared/engine/risk/sensitivity';
import { correlatedUniforms, runMonteCarlo } from '../../../shared/engine/risk/monte-carlo';
import { normalQuantile } from '../../../shared/engine/risk/distributions';
import { createRandom } from '../../../shared/engine/risk/random';
import { riskScenario } from '../engine/fixtures';

const optionById = (scenario: Scenario, id: string) => {
  const option = scenario.options.find((o) => o.id === id);
  if (!option) throw new Error(`no option ${id}`);
  return option;
};

const withYearlyIndex = (scenario: Scenario, milkPrice: number[] | null, feed: number[] | null): Scenario => ({
  ...scenario,
  herd: { ...scenario.herd, yearlyPriceIndex: { milkPrice, feed } },
});

/** Pearson correlation of two samples (textbook definition: cov(x, y) / (sd x · sd y)). */
function correlation(x: readonly number[], y: readonly number[]): number {
  const n = x.length;
  const mx = x.reduce((a, b) => a + b, 0) / n;
  const my = y.reduce((a, b) => a + b, 0) / n;
  let sxy = 0, sxx = 0, syy = 0;
  for (let i = 0; i < n; i++) {
    const dx = (x[i] ?? 0) - mx;
    const dy = (y[i] ?? 0) - my;
    sxy += dx * dy;
    sxx += dx * dx;
    syy += dy * dy;
  }
  return sxy / Math.sqrt(sxx * syy);
}

describe('risk inputs that are not plain multipliers', () => {
  const base = riskScenario();
  const current = base.options.find((o) => o.current) ?? base.options[0];
  const candidate = base.options.find((o) => !o.current && o.lyingHoursPerDay !== current?.lyingHoursPerDay);

  it('scales each candidate\'s lying-time gain over the current option, leaving the current option alone', () => {
    if (!current || !candidate) throw new Error('fixture needs a current option and a candidate with another lying time');
    const moved = perturb(base, 'lyingHours', 1.5);
    // Hand arithmetic: L' = L_current + (L_candidate − L_current) × 1.5.
    const expected = current.lyingHoursPerDay + (candidate.lyingHoursPerDay - current.lyingHoursPerDay) * 1.5;
    expect(optionById(moved, candidate.id).lyingHoursPerDay).toBeCloseTo(expected, 12);
    expect(optionById(moved, current.id).lyingHoursPerDay).toBe(current.lyingHoursPerDay);
    // A half gain: 10 h current, 12 h candidate → 11 h.
    const simple = { ...base, options: base.options.map((o) => ({ ...o, lyingHoursPerDay: o.id === current.id ? 10 : 12 })) };
    expect(optionById(perturb(simple, 'lyingHours', 0.5), candidate.id).lyingHoursPerDay).toBeCloseTo(11, 12);
  });

  it('shifts milk growth by 5 points a year per unit of the growth-gap multiplier, feed left as entered', () => {
    // Milk left to follow general inflation (2 %): a multiplier of 1.2 → 2 % + 0.2 × 5 % = 3 %; 0.8 → 1 %.
    const neutral = { ...base, herd: { ...base.herd, growth: { ...base.herd.growth, milkPrice: null, feed: null, general: 0.02 } } };
    expect(perturb(neutral, 'milkFeedGrowthGap', 1.2).herd.growth.milkPrice).toBeCloseTo(0.03, 12);
    expect(perturb(neutral, 'milkFeedGrowthGap', 0.8).herd.growth.milkPrice).toBeCloseTo(0.01, 12);
    expect(perturb(neutral, 'milkFeedGrowthGap', 0.8).herd.growth.feed).toBeNull();
  });
});

describe('yearly price index', () => {
  const base = riskScenario(10);

  it('scales the milk income of the indexed years only (a two-year trough at 80 %)', () => {
    const plain = evaluateScenario(base);
    const trough = evaluateScenario(withYearlyIndex(base, [0.8, 0.8], null));
    plain.options.forEach((option, i) => {
      const before = (year: number) => option.years.find((y) => y.year === year);
      const after = (year: number) => trough.options[i]?.years.find((y) => y.year === year);
      // Year 1 and 2: milk income × 0.8 (to the cent); year 3 on: as before.
      expect(after(1)?.milkIncome).toBeCloseTo((before(1)?.milkIncome ?? NaN) * 0.8, 1);
      expect(after(2)?.milkIncome).toBeCloseTo((before(2)?.milkIncome ?? NaN) * 0.8, 1);
      expect(after(3)?.milkIncome).toBe(before(3)?.milkIncome);
      expect(after(1)?.feed).toBe(before(1)?.feed);
    });
  });

  it('scales feed in the indexed year and keeps the fast path equal to the full evaluation', () => {
    const indexed = withYearlyIndex(base, [1, 0.9, 1.1], [1.2]);
    const full = evaluateScenario(indexed);
    const plain = evaluateScenario(base);
    const feedInYear1 = (result: typeof full) => result.options[0]?.years.find((y) => y.year === 1)?.feed ?? NaN;
    expect(feedInYear1(full)).toBeCloseTo(feedInYear1(plain) * 1.2, 1);
    const fast = evaluateNpvOnly(indexed);
    full.options.forEach((option, i) => {
      expect(fast[i]?.npv).toBeCloseTo(option.npv, 6);
      expect(fast[i]?.minCoverage ?? null).toEqual(option.lowestCoverage?.value ?? null);
    });
  });
});

describe('sensitivity of the lowest coverage', () => {
  // Horizon = the 15-year loan term, so every year carries this loan's payment.
  const base = riskScenario(15);
  const result = sensitivity(base);

  it('reports the lowest whole-farm coverage at each end, equal to a run with that input moved', () => {
    const low = evaluateNpvOnly(perturb(base, 'interestRate', 0.8));
    const high = evaluateNpvOnly(perturb(base, 'interestRate', 1.2));
    let moved = 0;
    result.options.forEach((option, i) => {
      const interest = option.lowestCoverage.find((s) => s.key === 'interestRate');
      expect(interest?.atLow).toBe(low[i]?.minCoverage ?? null);
      expect(interest?.atHigh).toBe(high[i]?.minCoverage ?? null);
      // A dearer loan means larger payments: where the option borrows, the ratio's denominator
      // grows and the lowest coverage moves towards 0, so the swing is not zero even where the
      // (unlevered) NPV barely moves.
      if (interest && interest.swing > 0) {
        moved += 1;
        expect(Math.abs(interest.atHigh ?? 0)).toBeLessThan(Math.abs(interest.atLow ?? 0));
      }
    });
    expect(moved).toBeGreaterThan(0);
  });

  it('lists the coverage swings in the order of the change\'s NPV swings', () => {
    for (const option of result.options) {
      const order = (option.incrementalNpv ?? option.npv).map((s) => s.key);
      expect(option.lowestCoverage.map((s) => s.key)).toEqual(order);
    }
  });
});

describe('Monte Carlo price draws', () => {
  it('gives the raw uniforms when ρ = 0 and normal scores correlated near ρ otherwise (Gaussian copula)', () => {
    const inputs = [
      { key: 'milkPrice' as const, distribution: 'triangular' as const, min: 0.8, mode: 1, max: 1.2 },
      { key: 'housedFeedCost' as const, distribution: 'triangular' as const, min: 0.8, mode: 1, max: 1.2 },
    ];
    const a = createRandom(7);
    const b = createRandom(7);
    const raw = [a.next(), a.next()];
    expect(correlatedUniforms(inputs, b, 0)).toEqual(raw);
    // Copula definition: the normal scores Φ⁻¹(u) of the two draws have correlation ρ; with
    // 20 000 draws the sample value lies within ±0.02 of 0.6 (standard error ≈ (1 − ρ²)/√n ≈ 0.005).
    const random = createRandom(11);
    const milk: number[] = [];
    const feed: number[] = [];
    for (let i = 0; i < 20000; i++) {
      const [u1, u2] = correlatedUniforms(inputs, random, 0.6);
      milk.push(normalQuantile(u1 ?? 0.5));
      feed.push(normalQuantile(u2 ?? 0.5));
    }
    expect(correlation(milk, feed)).toBeGreaterThan(0.58);
    expect(correlation(milk, feed)).toBeLessThan(0.62);
  });

  it('with prices drawn per year, a fixed 90 % milk draw equals the milk price × 0.9 in every year', () => {
    const base = riskScenario(10);
    const settings = { draws: 100, seed: 3, inputs: [{ key: 'milkPrice' as const, distribution: 'triangular' as const, min: 0.9, mode: 0.9, max: 0.9 }], pricesPerYear: true };
    const run = runMonteCarlo(base, settings);
    const scaled = evaluateNpvOnly(perturb(base, 'milkPrice', 0.9));
    run.options.forEach((option, i) => expect(option.npv.p50 ?? NaN).toBeCloseTo(scaled[i]?.npv ?? NaN, 0));
  });

  it('with prices drawn per year, the spread of the NPV narrows (yearly draws average out over the horizon)', () => {
    const base = riskScenario(15);
    const inputs = [{ key: 'milkPrice' as const, distribution: 'triangular' as const, min: 0.8, mode: 1, max: 1.2 }];
    const spread = (pricesPerYear: boolean) => {
      const npv = runMonteCarlo(base, { draws: 300, seed: 5, inputs, pricesPerYear }).options[0]?.npv;
      return (npv?.p90 ?? 0) - (npv?.p10 ?? 0);
    };
    expect(spread(true)).toBeLessThan(spread(false));
  });
});
