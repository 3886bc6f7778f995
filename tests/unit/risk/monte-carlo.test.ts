import { describe, expect, it } from 'vitest';
import { evaluateNpvOnly } from '../../../shared/engine/evaluate';
import { perturb } from '../../../shared/engine/risk/perturb';
import { MONTE_CARLO_BLOCK_DRAWS, mergeMonteCarloSamples, prepareMonteCarlo, runMonteCarlo, runMonteCarloBlocks, type MonteCarloSettings } from '../../../shared/engine/risk/monte-carlo';
import { riskScenario } from '../engine/fixtures';

const scenario = riskScenario();
const settings = (changes: Partial<MonteCarloSettings> = {}): MonteCarloSettings => ({ ...scenario.risk.monteCarlo, draws: 300, ...changes });

describe('runMonteCarlo', () => {
  it('gives identical results for the same seed', () => {
    expect(runMonteCarlo(scenario, settings())).toEqual(runMonteCarlo(scenario, settings()));
  });

  it('gives different results for different seeds', () => {
    const a = runMonteCarlo(scenario, settings({ seed: 1 }));
    const b = runMonteCarlo(scenario, settings({ seed: 2 }));
    expect(a.options[1]?.npv.mean).not.toBe(b.options[1]?.npv.mean);
  });

  it('gives the sequential result bit for bit from blocks run apart and merged in any grouping', () => {
    // Workers each run some blocks; the merge must not care how many ran or in which order they came back.
    // 1 300 draws: five full blocks and a short sixth; yearly prices make draws use many numbers each.
    for (const changes of [{}, { pricesPerYear: true }]) {
      const split = settings({ draws: 5 * MONTE_CARLO_BLOCK_DRAWS + 50, ...changes });
      const sequential = runMonteCarlo(scenario, split);
      const prepared = prepareMonteCarlo(scenario, split);
      expect(prepared.blocks).toBe(6);
      const groupings = [
        [[0, 6]],
        [[0, 1], [1, 2], [2, 3], [3, 4], [4, 5], [5, 6]],
        [[3, 6], [0, 2], [2, 3]],
        [[5, 6], [1, 5], [0, 1]],
      ];
      for (const ranges of groupings) {
        const parts = ranges.map(([from, to]) => runMonteCarloBlocks(prepared, from ?? 0, to ?? 0));
        expect(mergeMonteCarloSamples(prepared, parts)).toStrictEqual(sequential);
      }
    }
  });

  it('draws a block the same whatever the length of the run', () => {
    const short = prepareMonteCarlo(scenario, settings({ draws: 2 * MONTE_CARLO_BLOCK_DRAWS }));
    const long = prepareMonteCarlo(scenario, settings({ draws: 4 * MONTE_CARLO_BLOCK_DRAWS }));
    expect(runMonteCarloBlocks(long, 1, 2)).toStrictEqual(runMonteCarloBlocks(short, 1, 2));
    expect(runMonteCarloBlocks(long, 2, 3)).not.toStrictEqual(runMonteCarloBlocks(long, 1, 2));
  });

  it('reports progress after every block up to the total', () => {
    const seen: number[] = [];
    runMonteCarlo(scenario, settings({ draws: 600 }), { onProgress: (done, total) => seen.push(done, total) });
    expect(seen).toEqual([250, 600, 500, 600, 600, 600]);
  });

  it('stops early when cancelled and says so', () => {
    let blocks = 0;
    const result = runMonteCarlo(scenario, settings({ draws: 1000 }), {
      onProgress: () => (blocks += 1),
      isCancelled: () => blocks >= 2,
    });
    expect(result.cancelled).toBe(true);
    expect(result.drawsDone).toBe(500);
    expect(result.drawsRequested).toBe(1000);
    expect(result.options[1]?.npv.histogram.reduce((s, b) => s + b.count, 0)).toBe(500);
  });

  it('reproduces the deterministic NPV when no input is uncertain', () => {
    // With every multiplier at 1 each draw is the base scenario: all percentiles equal its NPV (definition).
    const result = runMonteCarlo(scenario, settings({ inputs: [], draws: 100 }));
    const base = evaluateNpvOnly(scenario);
    result.options.forEach((option, i) => {
      expect(option.npv.p10).toBeCloseTo(base[i]?.npv ?? Number.NaN, 6);
      expect(option.npv.p90).toBeCloseTo(base[i]?.npv ?? Number.NaN, 6);
      expect(option.npv.mean).toBeCloseTo(base[i]?.npv ?? Number.NaN, 4);
    });
  });

  it('has a mean NPV at the mean milk price when NPV is linear in the price', () => {
    // Triangular mean (a+b+c)/3 and variance (a²+b²+c²−ab−ac−bc)/18 (standard results); with no
    // tax, NPV is affine in the milk price, so E[NPV(m)] = NPV(E[m]) (linearity of expectation).
    const [a, c, b] = [0.8, 1, 1.15];
    const draws = 2000;
    const result = runMonteCarlo(scenario, settings({ draws, inputs: [{ key: 'milkPrice', distribution: 'triangular', min: a, mode: c, max: b }] }));
    const expectedMultiplier = (a + b + c) / 3;
    const sd = Math.sqrt((a * a + b * b + c * c - a * b - a * c - b * c) / 18);
    const at = (m: number) => evaluateNpvOnly(perturb(scenario, 'milkPrice', m));
    const [low, mid, high] = [at(0.8), at(expectedMultiplier), at(1.2)];
    result.options.forEach((option, i) => {
      const slope = Math.abs(((high[i]?.npv ?? 0) - (low[i]?.npv ?? 0)) / 0.4);
      const tolerance = 5 * slope * (sd / Math.sqrt(draws)) + 1;
      expect(Math.abs((option.npv.mean ?? Number.NaN) - (mid[i]?.npv ?? 0))).toBeLessThan(tolerance);
    });
  });

  it('orders P10 ≤ P50 ≤ P90, keeps shares in [0, 1] and bins every draw', () => {
    const result = runMonteCarlo(scenario, settings());
    for (const option of result.options) {
      const { p10, p50, p90, probabilityNegative, histogram } = option.npv;
      expect(p10).not.toBeNull();
      expect(p10 ?? 0).toBeLessThanOrEqual(p50 ?? 0);
      expect(p50 ?? 0).toBeLessThanOrEqual(p90 ?? 0);
      expect(probabilityNegative).toBeGreaterThanOrEqual(0);
      expect(probabilityNegative).toBeLessThanOrEqual(1);
      expect(histogram.reduce((s, bin) => s + bin.count, 0)).toBe(result.drawsDone);
      expect(option.irr.definedDraws).toBeLessThanOrEqual(result.drawsDone);
      expect(option.incrementalNpv === null).toBe(option.current);
    }
  });

  it('counts draws whose coverage falls below the lender threshold', () => {
    // Whole-farm coverage = cash for debt service ÷ debt payments (FFSC, farmdoc daily 8:175, read);
    // existing debt is due every year, so each option has coverage to test.
    // The existing farm's cash moves with the herd's margin in each draw, so the strict case starts
    // from a farm with no cash beside what its herd earns today.
    const strict = riskScenario();
    const poor = { ...strict, herd: { ...strict.herd, existingCashForDebtServicePerYear: 0 } };
    const high = runMonteCarlo({ ...poor, finance: { ...poor.finance, coverageThreshold: 5 } }, settings({ draws: 100 }));
    const rich = { ...strict, herd: { ...strict.herd, existingCashForDebtServicePerYear: 1e8 } };
    const low = runMonteCarlo({ ...rich, finance: { ...rich.finance, coverageThreshold: 0.5 } }, settings({ draws: 100 }));
    for (const option of high.options) expect(option.probabilityCoverageBelowThreshold).toBe(1);
    for (const option of low.options) expect(option.probabilityCoverageBelowThreshold).toBe(0);
  });

  it('reports coverage as not applicable when nothing is ever due', () => {
    const base = riskScenario();
    const debtFree = {
      ...base,
      herd: { ...base.herd, existingDebtPaymentsPerYear: 0 },
      finance: { ...base.finance, loanAmount: 0 },
    };
    const current = runMonteCarlo(debtFree, settings({ draws: 100 })).options.find((o) => o.current);
    expect(current?.probabilityCoverageBelowThreshold).toBeNull();
    expect(current?.coverageReason).toBe('no-debt-service');
  });
});
