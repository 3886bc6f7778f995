import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { findRoot } from '@shared/engine/root';

describe('findRoot', () => {
  it('finds √2 as the root of x² − 2 on [0, 2]', () => {
    // mathematical identity
    const result = findRoot((x) => x * x - 2, 0, 2);
    expect(result.value ?? Number.NaN).toBeCloseTo(Math.SQRT2, 12);
  });

  it('finds the fixed point of cos x', () => {
    // the Dottie number, cos x = x at 0.739085133215160… (from memory)
    const result = findRoot((x) => Math.cos(x) - x, 0, 1);
    expect(result.value ?? Number.NaN).toBeCloseTo(0.73908513321516, 12);
  });

  it('returns an end point that is itself a root', () => {
    // definition: f(lo) = 0
    expect(findRoot((x) => x - 1, 1, 3)).toEqual({ value: 1 });
  });

  it('reports none-in-range when the ends do not bracket a root', () => {
    // x² + 1 > 0 everywhere
    expect(findRoot((x) => x * x + 1, -5, 5)).toEqual({ value: null, reason: 'none-in-range' });
  });

  it('respects a coarse tolerance', () => {
    // mathematical identity: root of x − 0.3 is 0.3
    const result = findRoot((x) => x - 0.3, 0, 1, { tolerance: 1e-3 });
    expect(Math.abs((result.value ?? Number.NaN) - 0.3)).toBeLessThanOrEqual(1e-3);
  });

  it('solves a linear break-even within tolerance for any bracketed root', () => {
    // mathematical identity: a(x − r) = 0 at x = r
    fc.assert(
      fc.property(
        fc.double({ min: -100, max: 100, noNaN: true }),
        fc.double({ min: 0.01, max: 1000, noNaN: true }),
        (root, slope) => {
          const result = findRoot((x) => slope * (x - root), -101, 101);
          expect(Math.abs((result.value ?? Number.NaN) - root)).toBeLessThan(1e-9);
        },
      ),
      { numRuns: 200 },
    );
  });

  it('rejects an empty interval and a non-finite f, naming the problem', () => {
    expect(() => findRoot((x) => x, 1, 1)).toThrow(/lo/);
    expect(() => findRoot(() => Number.NaN, 0, 1)).toThrow(/f\(/);
    expect(() => findRoot((x) => x, -1, 1, { maxIterations: 0 })).toThrow(/maxIterations/);
  });
});
