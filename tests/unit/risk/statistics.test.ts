import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { histogram, mean, percentile, percentileSorted } from '../../../shared/engine/risk/statistics';

describe('percentile (linear interpolation between order statistics)', () => {
  it('matches the numpy.percentile documentation example', () => {
    // numpy.percentile docs: a = [[10, 7, 4], [3, 2, 1]]; percentile(a, 50) = 3.5;
    // along axis 0: [6.5, 4.5, 2.5] (read, numpy reference documentation).
    expect(percentile([10, 7, 4, 3, 2, 1], 0.5)).toBe(3.5);
    expect(percentile([10, 3], 0.5)).toBe(6.5);
    expect(percentile([7, 2], 0.5)).toBe(4.5);
    expect(percentile([4, 1], 0.5)).toBe(2.5);
  });

  it('interpolates a hand example: [0..7] at 25/50/75 % gives 1.75, 3.5, 5.25', () => {
    // Hand computation with h = (n−1)p: 7·0.25 = 1.75 → 1 + 0.75·(2−1) = 1.75; also the value the
    // numpy 'linear' method gives for this array (Programiz numpy.percentile page, read, secondary).
    const values = [0, 1, 2, 3, 4, 5, 6, 7];
    expect(percentile(values, 0.25)).toBe(1.75);
    expect(percentile(values, 0.5)).toBe(3.5);
    expect(percentile(values, 0.75)).toBe(5.25);
  });

  it('follows numpy\'s documented linear rule i + (j − i)·fraction at every index', () => {
    // numpy docs, method 'linear': i + (j − i) * fraction, fraction the fractional part of the
    // index (n−1)·q/100 surrounded by i and j (read).
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true }), { minLength: 1, maxLength: 50 }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (values, p) => {
          const sorted = [...values].sort((x, y) => x - y);
          const index = (sorted.length - 1) * p;
          const i = sorted[Math.floor(index)] as number;
          const j = sorted[Math.min(Math.ceil(index), sorted.length - 1)] as number;
          const expected = i + (j - i) * (index - Math.floor(index));
          expect(percentileSorted(sorted, p)).toBeCloseTo(expected, 6);
        },
      ),
    );
  });

  it('gives the minimum at 0 and the maximum at 1, and null for no values', () => {
    // numpy docs: q = 0 and q = 100 give the minimum and maximum (read).
    expect(percentile([5, -2, 9], 0)).toBe(-2);
    expect(percentile([5, -2, 9], 1)).toBe(9);
    expect(percentile([], 0.5)).toBeNull();
  });

  it('does not reorder its input', () => {
    const values = [3, 1, 2];
    percentile(values, 0.5);
    expect(values).toEqual([3, 1, 2]);
  });
});

describe('mean', () => {
  it('is the arithmetic mean, null for no values', () => {
    // Definition: Σx / n.
    expect(mean([1, 2, 3, 4])).toBe(2.5);
    expect(mean([])).toBeNull();
  });
});

describe('histogram', () => {
  it('counts every value once, with the maximum in the closed last bin', () => {
    // numpy.histogram docs: all bins half-open except the last, which includes its right edge (read).
    // Hand count over [0, 3] in three unit-wide bins: {0}, {1, 1}, {2, 3}.
    const bins = histogram([0, 1, 1, 2, 3], 3);
    expect(bins.map((b) => b.count)).toEqual([1, 2, 2]);
    expect(bins[0]?.from).toBe(0);
    expect(bins[2]?.to).toBe(3);
  });

  it('widens a single repeated value to value ± 0.5', () => {
    // numpy.histogram: when min == max the range becomes (min − 0.5, max + 0.5) (from memory).
    const bins = histogram([4, 4, 4], 2);
    expect(bins[0]?.from).toBe(3.5);
    expect(bins[1]?.to).toBe(4.5);
    expect(bins.reduce((s, b) => s + b.count, 0)).toBe(3);
  });

  it('conserves the number of values for any data', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: -1e9, max: 1e9, noNaN: true }), { maxLength: 200 }), fc.integer({ min: 1, max: 60 }), (values, n) => {
        const total = histogram(values, n).reduce((s, b) => s + b.count, 0);
        expect(total).toBe(values.length);
      }),
    );
  });
});
