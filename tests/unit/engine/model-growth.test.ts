import { describe, expect, it } from 'vitest';
import { evaluateScenario } from '../../../shared/engine/evaluate';
import { milkLagsFeedBy, resolvedGrowth } from '../../../shared/engine/growth';
import { growthRatesSchema } from '../../../shared/schema';
import { handScenario } from './hand-scenario';

describe('neutral growth defaults (docs: shared/engine/README.md, "Growth")', () => {
  it('lets every price group left empty follow general inflation', () => {
    const growth = growthRatesSchema.parse({ general: 0.025, wages: 0.04 });
    expect(growth.milkPrice).toBeNull();
    expect(resolvedGrowth(growth)).toEqual({ milkPrice: 0.025, feed: 0.025, wages: 0.04, bedding: 0.025, fertiliser: 0.025, general: 0.025 });
    // With nothing entered every group grows at the default 2 % inflation.
    expect(resolvedGrowth(growthRatesSchema.parse({}))).toEqual({ milkPrice: 0.02, feed: 0.02, wages: 0.02, bedding: 0.02, fertiliser: 0.02, general: 0.02 });
  });

  it('grows milk income at general inflation when milk growth is left empty', () => {
    // Hand case: 100 cows × 30 kg × 365 = 1 095 000 kg at 0.40 = 438 000 today; current option (no lying gain).
    const scenario = handScenario((input) => {
      input.herd.growth = { general: 0.03 };
    });
    const current = evaluateScenario(scenario).options.find((o) => o.current);
    // Year 2: 438 000 × 1.03² = 464 674.20.
    expect(current?.years[2]?.milkIncome).toBe(464_674.2);
  });

  it('warns when milk grows slower than feed, and not when they grow alike', () => {
    const lagging = handScenario((input) => {
      input.herd.growth = { milkPrice: 0.01, feed: 0.02, general: 0.02 };
    });
    // 2 % − 1 % = 1 point a year.
    expect(milkLagsFeedBy(lagging.herd.growth)).toBeCloseTo(0.01, 12);
    const warnings = evaluateScenario(lagging).warnings;
    expect(warnings.map((w) => w.code)).toEqual(['milk-growth-below-feed']);
    expect(warnings[0]?.message).toMatch(/1 % a year slower than feed/);
    const even = handScenario((input) => {
      input.herd.growth = { general: 0.02 };
    });
    expect(evaluateScenario(even).warnings).toEqual([]);
  });
});
