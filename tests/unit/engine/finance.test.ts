import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { irr as referenceIrr, mirr as referenceMirr, npv as referenceNpv, pmt } from 'financial';
import {
  IRR_RANGE,
  capitalRecoveryFactor,
  cumulative,
  discount,
  discountedPaybackYears,
  equivalentAnnualCost,
  irr,
  levelPayment,
  mirr,
  npv,
  paybackYears,
  profitabilityIndex,
  spreadsheetNpv,
} from '@shared/engine/finance';
import { toCents } from '../../oracles/cents';

const GITMAN_NPV_FLOWS = [-40_000, 5_000, 8_000, 12_000, 30_000];
const GITMAN_IRR_FLOWS = [-100, 39, 59, 55, 20];

/** A cash-flow series: finite amounts within ± 1 million. */
const flowsArb = fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true }), { minLength: 1, maxLength: 41 });

/** An investment: one or more outlays, then one or more inflows — exactly one sign change. */
const investmentArb = fc
  .tuple(
    fc.array(fc.double({ min: -1e6, max: -1, noNaN: true }), { minLength: 1, maxLength: 3 }),
    fc.array(fc.double({ min: 1, max: 1e6, noNaN: true }), { minLength: 1, maxLength: 38 }),
  )
  .map(([outlays, inflows]) => [...outlays, ...inflows]);

function scale(flows: readonly number[], rate: number): number {
  return flows.reduce((s, cf, t) => s + Math.abs(cf) / (1 + rate) ** t, 1);
}

describe('npv', () => {
  it('matches the Gitman NPV example with the first flow at t = 0', () => {
    // Gitman, Principles of Managerial Finance, Brief, 3rd ed. (2003), p. 346, via numpy-financial npv docs (read)
    expect(npv(0.08, GITMAN_NPV_FLOWS)).toBeCloseTo(3065.22267, 5);
  });

  it('discounts the first value one period in the spreadsheet convention', () => {
    // docs/references.md: derived from Gitman p. 346, 3 065.22267 / 1.08 = 2 838.16914
    expect(spreadsheetNpv(0.08, GITMAN_NPV_FLOWS)).toBeCloseTo(2838.16914, 5);
  });

  it('agrees with the financial package npv (values[0] at t = 0) on generated series', () => {
    // second reference: `financial` 0.2.4 npv, numpy convention (docs/references.md)
    fc.assert(
      fc.property(fc.double({ min: -0.5, max: 1, noNaN: true }), flowsArb, (rate, flows) => {
        const ours = npv(rate, flows);
        expect(Math.abs(ours - referenceNpv(rate, [...flows]))).toBeLessThanOrEqual(1e-9 * scale(flows, rate));
      }),
      { numRuns: 300 },
    );
  });

  it('is the plain sum of the flows at a zero rate', () => {
    // definition: (1 + 0)^t = 1
    expect(npv(0, [-100, 30, 30, 50])).toBe(10);
  });

  it('rejects a rate of −100 % or below, naming the field', () => {
    expect(() => npv(-1, [1, 2])).toThrow(/rate/);
    expect(() => npv(0.1, [1, Number.NaN])).toThrow(/flows\[1\]/);
  });
});

describe('discount and cumulative', () => {
  it('discounts each flow by its own period', () => {
    // hand calculation: 121 / 1.1^2 = 100, 110 / 1.1 = 100
    const pv = discount(0.1, [-200, 110, 121]);
    expect(pv[0]).toBe(-200);
    expect(pv[1]).toBeCloseTo(100, 10);
    expect(pv[2]).toBeCloseTo(100, 10);
  });

  it('keeps running totals', () => {
    // hand calculation: −1000, −700, −300, 200
    expect(cumulative([-1000, 300, 400, 500])).toEqual([-1000, -700, -300, 200]);
  });
});

describe('irr', () => {
  it('matches the Gitman IRR example', () => {
    // Gitman, Principles of Managerial Finance, Brief, 3rd ed. (2003), p. 348, via numpy-financial irr docs (read)
    const result = irr(GITMAN_IRR_FLOWS);
    expect(result.value).not.toBeNull();
    expect(result.value ?? Number.NaN).toBeCloseTo(0.28095, 5);
  });

  it('agrees with the financial package irr on series with one sign change', () => {
    // second reference: `financial` 0.2.4 irr (Newton from 10 %; NaN when it fails, so compared only where it converges)
    let compared = 0;
    fc.assert(
      fc.property(investmentArb, (flows) => {
        const ours = irr(flows);
        const theirs = referenceIrr([...flows]);
        if (Number.isFinite(theirs) && theirs > IRR_RANGE.lo + 1e-3 && theirs < IRR_RANGE.hi) {
          compared++;
          expect(ours.value).not.toBeNull();
          expect(Math.abs((ours.value ?? Number.NaN) - theirs)).toBeLessThan(1e-6);
        }
        if (ours.value !== null) {
          // definition of IRR: NPV at the rate is zero, relative to the size of the flows
          expect(Math.abs(npv(ours.value, flows))).toBeLessThan(1e-7 * scale(flows, ours.value));
        } else {
          expect(ours.reason).toBe('no-root');
        }
      }),
      { numRuns: 400 },
    );
    expect(compared).toBeGreaterThan(100);
  });

  it('returns null with both roots when −100, 230, −132 has IRRs of 10 % and 20 %', () => {
    // hand calculation: −100 + 230/1.1 − 132/1.21 = −100 + 209.0909 − 109.0909 = 0;
    // −100 + 230/1.2 − 132/1.44 = −100 + 191.6667 − 91.6667 = 0
    const result = irr([-100, 230, -132]);
    expect(result.value).toBeNull();
    if (result.value !== null) return;
    expect(result.reason).toBe('multiple-roots');
    expect(result.roots).toHaveLength(2);
    expect(result.roots?.[0]).toBeCloseTo(0.1, 9);
    expect(result.roots?.[1]).toBeCloseTo(0.2, 9);
  });

  it('separates two IRRs half a percentage point apart', () => {
    // hand calculation: −100(1 + r)² + 220.9(1 + r) − 121.9914 = −100(1 + r − 1.102)(1 + r − 1.107),
    // so dividing by (1 + r)² gives flows −100, 220.9, −121.9914 with roots 10.2 % and 10.7 %
    const result = irr([-100, 220.9, -121.9914]);
    expect(result).toMatchObject({ value: null, reason: 'multiple-roots' });
    const roots = result.value === null ? (result.roots ?? []) : [];
    expect(roots).toHaveLength(2);
    expect(roots[0]).toBeCloseTo(0.102, 9);
    expect(roots[1]).toBeCloseTo(0.107, 9);
  });

  it('gives the single root when several sign changes still leave one IRR', () => {
    // hand calculation: with x = 1/(1 + r), NPV = 80x³ − 10x² + 50x − 100, whose derivative
    // 240x² − 20x + 50 has no real zero, so there is one root; NPV(0) = +20, NPV(10 %) = −2.70
    const result = irr([-100, 50, -10, 80]);
    expect(result.value).not.toBeNull();
    const rate = result.value ?? Number.NaN;
    expect(rate).toBeGreaterThan(0);
    expect(rate).toBeLessThan(0.1);
    expect(Math.abs(npv(rate, [-100, 50, -10, 80]))).toBeLessThan(1e-9);
  });

  it('reports no-sign-change for all-positive, all-negative and all-zero flows', () => {
    // definition: NPV of one-signed flows never crosses zero
    expect(irr([100, 50, 20])).toEqual({ value: null, reason: 'no-sign-change' });
    expect(irr([-100, 0, -20])).toEqual({ value: null, reason: 'no-sign-change' });
    expect(irr([0, 0, 0])).toEqual({ value: null, reason: 'no-sign-change' });
  });

  it('ignores zeros when counting sign changes', () => {
    // hand calculation: −100, 0, 121 → (1 + r)^2 = 1.21 → r = 10 %
    expect(irr([-100, 0, 121]).value ?? Number.NaN).toBeCloseTo(0.1, 10);
  });

  it('reports no-root when the only root lies beyond the searched range', () => {
    // hand calculation: −1, 20 → IRR = 1 900 %, above the 1 000 % ceiling
    expect(irr([-1, 20])).toEqual({ value: null, reason: 'no-root' });
  });

  it('reports no-root for −100, 250, −200, where NPV stays negative', () => {
    // hand calculation: with x = 1/(1 + r), −200x² + 250x − 100 has discriminant 62 500 − 80 000 < 0
    expect(irr([-100, 250, -200])).toEqual({ value: null, reason: 'no-root' });
  });
});

describe('mirr', () => {
  it('matches the spreadsheet MIRR documentation example', () => {
    // spreadsheet MIRR() help example, from memory: −120 000, 39 000, 30 000, 21 000, 37 000, 46 000,
    // finance 10 %, reinvest 12 % → 12.61 %; first four values → −4.80 %; reinvest 14 % → 13.48 %
    const flows = [-120_000, 39_000, 30_000, 21_000, 37_000, 46_000];
    expect(mirr(flows, 0.1, 0.12) ?? Number.NaN).toBeCloseTo(0.1261, 4);
    expect(mirr(flows.slice(0, 4), 0.1, 0.12) ?? Number.NaN).toBeCloseTo(-0.048, 4);
    expect(mirr(flows, 0.1, 0.14) ?? Number.NaN).toBeCloseTo(0.1348, 4);
  });

  it('matches a hand calculation with an outlay in year 1', () => {
    // hand calculation: −1000, −100, 800, 600 with finance 10 %, reinvest 5 %, n = 3:
    // PV⁻ = 1000 + 100/1.1 = 1090.9091; FV⁺ = 800 × 1.05 + 600 = 1440;
    // 1440 / 1090.9091 = 1.32 → MIRR = 1.32^(1/3) − 1 = 0.09696
    expect(mirr([-1000, -100, 800, 600], 0.1, 0.05) ?? Number.NaN).toBeCloseTo(Math.cbrt(1.32) - 1, 12);
    expect(Math.cbrt(1.32) - 1).toBeCloseTo(0.09696, 5);
  });

  it('agrees with the financial package mirr on generated series', () => {
    // second reference: `financial` 0.2.4 mirr (numpy-financial), same spreadsheet definition
    fc.assert(
      fc.property(investmentArb, fc.double({ min: 0, max: 0.2, noNaN: true }), fc.double({ min: 0, max: 0.2, noNaN: true }), (flows, f, r) => {
        expect(mirr(flows, f, r) ?? Number.NaN).toBeCloseTo(referenceMirr([...flows], f, r), 9);
      }),
      { numRuns: 200 },
    );
  });

  it('is null without both a negative and a positive flow', () => {
    // definition: MIRR needs an outlay to discount and an inflow to compound
    expect(mirr([100, 200], 0.1, 0.1)).toBeNull();
    expect(mirr([-100, -200], 0.1, 0.1)).toBeNull();
    expect(mirr([-100], 0.1, 0.1)).toBeNull();
  });
});

describe('payback', () => {
  it('interpolates inside the year the cumulative flow turns non-negative', () => {
    // hand calculation: cumulative −1000, −700, −300, +200 → year 3: 2 + 300/500 = 2.6
    expect(paybackYears([-1000, 300, 400, 500])).toBeCloseTo(2.6, 12);
  });

  it('counts a cumulative exactly zero as paid back', () => {
    // hand calculation: −1000 + 500 + 500 = 0 at the end of year 2
    expect(paybackYears([-1000, 500, 500, 500])).toBe(2);
  });

  it('is null when the flows never pay back and 0 when there is no outlay', () => {
    // hand calculation: −1000 + 300 + 300 = −400 at the horizon
    expect(paybackYears([-1000, 300, 300])).toBeNull();
    expect(paybackYears([0, 300])).toBe(0);
    expect(paybackYears([50, -300, 300])).toBe(0);
  });

  it('pays back later on discounted flows', () => {
    // hand calculation at 10 %: −1000, 660/1.1 = 600, 726/1.21 = 600 → 1 + 400/600 = 1.6667
    expect(discountedPaybackYears(0.1, [-1000, 660, 726])).toBeCloseTo(1 + 400 / 600, 10);
    // hand calculation: simple payback of the same flows is 1 + 340/726
    expect(paybackYears([-1000, 660, 726])).toBeCloseTo(1 + 340 / 726, 10);
    // hand calculation at 10 %: 550/1.1 + 550/1.21 = 954.55 < 1000 → never
    expect(discountedPaybackYears(0.1, [-1000, 550, 550])).toBeNull();
  });
});

describe('profitabilityIndex', () => {
  it('divides the present value of later flows by the outlay', () => {
    // hand calculation at 10 %: (660/1.1 + 726/1.21) / 1000 = (600 + 600) / 1000 = 1.2
    expect(profitabilityIndex(0.1, [-1000, 660, 726]) ?? Number.NaN).toBeCloseTo(1.2, 12);
  });

  it('equals 1 + NPV / outlay on the Gitman flows', () => {
    // Gitman p. 346 via numpy-financial docs (read): NPV 3 065.22267 on an outlay of 40 000
    expect(profitabilityIndex(0.08, GITMAN_NPV_FLOWS) ?? Number.NaN).toBeCloseTo(1 + 3065.22267 / 40_000, 8);
  });

  it('is null without an outlay at t = 0', () => {
    // definition: nothing to divide by
    expect(profitabilityIndex(0.1, [0, 100])).toBeNull();
    expect(profitabilityIndex(0.1, [10, 100])).toBeNull();
  });
});

describe('capital recovery and level payments', () => {
  it('gives the interest-table A/P factor', () => {
    // engineering economy compound interest tables, A/P at 10 %, 10 years = 0.16275 (from memory)
    expect(capitalRecoveryFactor(0.1, 10)).toBeCloseTo(0.16275, 5);
    // hand calculation: 1/n at a zero rate
    expect(capitalRecoveryFactor(0, 8)).toBe(0.125);
  });

  it('stays continuous next to a zero rate', () => {
    // limit of r / (1 − (1 + r)^−n) as r → 0 is 1/n
    expect(capitalRecoveryFactor(1e-12, 10)).toBeCloseTo(0.1, 10);
  });

  it('spreads a present cost into an equivalent annual cost', () => {
    // standard annuity example (docs/references.md): 5 000 at 9 % over 5 years → 1 285.46 a year
    expect(toCents(equivalentAnnualCost(5000, 0.09, 5))).toBe(1285.46);
  });

  it('matches the numpy pmt example as a positive amount', () => {
    // numpy pmt documentation (read): 200 000 at 7.5 %/12 for 180 months → −1 854.02472
    expect(levelPayment(200_000, 0.075 / 12, 180)).toBeCloseTo(1854.02472, 5);
  });

  it('is the negated financial pmt on generated loans', () => {
    // second reference: `financial` 0.2.4 pmt (numpy convention, returns the payment negative)
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 1e7, noNaN: true }),
        fc.oneof(fc.constant(0), fc.double({ min: 1e-6, max: 0.05, noNaN: true })),
        fc.integer({ min: 1, max: 480 }),
        (principal, rate, periods) => {
          const theirs = -pmt(rate, periods, principal);
          expect(Math.abs(levelPayment(principal, rate, periods) - theirs)).toBeLessThanOrEqual(1e-9 * (1 + Math.abs(theirs)));
        },
      ),
      { numRuns: 300 },
    );
  });

  it('rejects a non-positive term, naming the field', () => {
    expect(() => capitalRecoveryFactor(0.1, 0)).toThrow(/years/);
    expect(() => levelPayment(1000, 0.01, 1.5)).toThrow(/periods/);
  });
});

describe('toCents', () => {
  it('rounds half-up on the decimal form of the number', () => {
    // decimal.js ROUND_HALF_UP documentation: ties round away from zero (from memory)
    expect(toCents(1.005)).toBe(1.01);
    expect(toCents(-1.005)).toBe(-1.01);
    expect(toCents(2.004999)).toBe(2);
    expect(() => toCents(Number.POSITIVE_INFINITY)).toThrow(/x/);
  });
});
