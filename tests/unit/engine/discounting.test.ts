import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { presentValue, presentValueSign } from '@shared/engine/discounting';

const flowsArb = fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true }), { minLength: 1, maxLength: 41 });
/** Rates over the IRR search range, −99 % to +1 000 % (docs/model.md "IRR"). */
const rateArb = fc.double({ min: -0.99, max: 10, noNaN: true });

describe('presentValueSign, the quick sign the IRR grid scan reads', () => {
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
