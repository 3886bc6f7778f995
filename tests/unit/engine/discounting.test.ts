import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { presentValue, presentValueSignReach, type SignReach } from '@shared/engine/discounting';
import { irr } from '@shared/engine/finance';

/** The sign alone, as the IRR grid scan reads it. */
function presentValueSign(rate: number, flows: number[]): number {
  const known: SignReach = { sign: 0, reach: 0 };
  presentValueSignReach(rate, flows, known);
  return known.sign;
}

const flowsArb = fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true }), { minLength: 1, maxLength: 41 });
/** Rates over the IRR search range, −99 % to +1 000 % (docs/model.md "IRR"). */
const rateArb = fc.double({ min: -0.99, max: 10, noNaN: true });

describe('presentValueSignReach, the quick sign the IRR grid scan reads', () => {
  it('has the sign of presentValue on any flows and rate', () => {
    fc.assert(
      fc.property(flowsArb, rateArb, (flows, rate) => {
        expect(presentValueSign(rate, flows)).toBe(Math.sign(presentValue(rate, flows)));
      }),
      { numRuns: 2000 },
    );
  });

  it('has the sign of presentValue where the NPV is zero or a rounding away from it', () => {
    // hand calculation: −100 + 230/1.1 − 132/1.21 = 0 and −100 + 230/1.2 − 132/1.44 = 0, so at
    // 10 % and 20 % (and a hair either side) presentValue is zero up to its own rounding.
    const flows = [-100, 230, -132];
    for (const rate of [0.1, 0.2, 0.1 + 1e-15, 0.2 - 1e-15, 0.1 + 1e-9, 0.2 - 1e-9]) {
      expect(presentValueSign(rate, flows), `rate ${rate}`).toBe(Math.sign(presentValue(rate, flows)));
    }
    // Flows that cancel exactly at 0 %: −50 + 20 + 30 = 0.
    expect(presentValueSign(0, [-50, 20, 30])).toBe(0);
    // And well away from a root the sign is plain: at 0 % the sum −100 + 230 − 132 = −2.
    expect(presentValueSign(0, flows)).toBe(-1);
  });
});

describe('presentValueSignReach, the sign the IRR grid scan carries over rates it skips', () => {
  it('keeps the sign of presentValue at every rate inside its reach', () => {
    fc.assert(
      fc.property(flowsArb, rateArb, fc.double({ min: 0, max: 1, noNaN: true }), (flows, rate, share) => {
        const known: SignReach = { sign: 0, reach: 0 };
        presentValueSignReach(rate, flows, known);
        expect(known.sign).toBe(Math.sign(presentValue(rate, flows)));
        expect(known.reach).toBeGreaterThanOrEqual(0);
        const later = rate + Math.min(known.reach, 20) * share;
        if (later <= 10) expect(Math.sign(presentValue(later, flows)), `rate ${later}`).toBe(known.sign);
      }),
      { numRuns: 3000 },
    );
  });

  it('reaches no further than the next root', () => {
    // hand calculation as above: −100 + 230/(1 + r) − 132/(1 + r)² is zero at 10 % and 20 %,
    // negative below 10 % and above 20 %, positive between.
    const known: SignReach = { sign: 0, reach: 0 };
    presentValueSignReach(0, [-100, 230, -132], known);
    expect(known.sign).toBe(-1);
    expect(known.reach).toBeLessThan(0.1);
    presentValueSignReach(0.15, [-100, 230, -132], known);
    expect(known.sign).toBe(1);
    expect(known.reach).toBeLessThan(0.05);
  });

  it('leaves the grid scan finding both roots of flows with two', () => {
    // The same flows: the IRR is ambiguous, with roots at 10 % and 20 %.
    const result = irr([-100, 230, -132]);
    expect(result.value).toBeNull();
    expect(result.value === null && result.reason).toBe('multiple-roots');
    const roots = result.value === null ? (result.roots ?? []) : [];
    expect(roots).toHaveLength(2);
    expect(roots[0]).toBeCloseTo(0.1, 10);
    expect(roots[1]).toBeCloseTo(0.2, 10);
  });
});
