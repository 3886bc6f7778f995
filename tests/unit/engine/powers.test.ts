import { describe, expect, it } from 'vitest';
import { growthFactor } from '../../../shared/engine/growth';
import { presentValue } from '../../../shared/engine';
import { powerTable } from '../../../shared/engine/powers';

// The remembered powers must be the very doubles (1 + r)^t gives, whatever was asked before:
// the seeded Monte Carlo results are pinned to them (docs/model.md, discounting and growth).
describe('remembered powers of a rate', () => {
  it('gives (1 + r)^t exactly, rates asked in turn and years out of order', () => {
    const power = powerTable();
    const asks: [number, number][] = [];
    for (const rate of [0.06, 0.02, 0.06, -0.5, 0, 0.123456789]) for (const t of [40, 0, 7, 3, 41, 1]) asks.push([rate, t]);
    for (const [rate, t] of asks) expect(Object.is(power(rate, t), (1 + rate) ** t), `${rate}, ${t}`).toBe(true);
  });

  it('computes other exponents directly: fractions, negatives and very long horizons', () => {
    const power = powerTable();
    for (const t of [0.5, -1, -3, 250, 2.75]) expect(Object.is(power(0.05, t), 1.05 ** t), String(t)).toBe(true);
  });

  it('leaves present values and growth factors as the formula gives them, however calls interleave', () => {
    const flows = [-500_000, 41_000.5, 52_300.25, 60_000, 61_200, 62_424, 63_672.48, 64_945.93, 66_244.85, 367_569.75];
    const direct = (rate: number): number => flows.reduce((total, cf, t) => total + cf / (1 + rate) ** t, 0);
    for (const rate of [0.06, 0.1, 0.06, 0.0725, 0.1]) {
      expect(presentValue(rate, flows)).toBe(direct(rate));
      expect(growthFactor(0.02, 0)).toBe(1);
      expect(growthFactor(rate / 3, 12)).toBe((1 + rate / 3) ** 12);
    }
  });
});
