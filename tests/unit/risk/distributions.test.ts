import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { createRandom } from '../../../shared/engine/risk/random';
import {
  normalCdf,
  normalQuantile,
  sampleTriangular,
  sampleTruncatedNormal,
  triangularQuantile,
  truncatedNormalQuantile,
} from '../../../shared/engine/risk/distributions';

const sampleMoments = (values: readonly number[]): { mean: number; variance: number } => {
  const n = values.length;
  const mean = values.reduce((s, v) => s + v, 0) / n;
  const variance = values.reduce((s, v) => s + (v - mean) ** 2, 0) / (n - 1);
  return { mean, variance };
};

describe('triangular distribution', () => {
  it('has sample mean (a+b+c)/3 and variance (a²+b²+c²−ab−ac−bc)/18', () => {
    // Triangular distribution mean (a+b+c)/3 and variance (a²+b²+c²−ab−ac−bc)/18: standard results.
    const dist = { min: 0.8, mode: 1.0, max: 1.5 };
    const random = createRandom(11);
    const n = 100_000;
    const values = Array.from({ length: n }, () => sampleTriangular(dist, random));
    const { mean, variance } = sampleMoments(values);
    const a = 0.8;
    const c = 1.0;
    const b = 1.5;
    const expectedVariance = (a * a + b * b + c * c - a * b - a * c - b * c) / 18;
    expect(Math.abs(mean - (a + b + c) / 3)).toBeLessThan(5 * Math.sqrt(expectedVariance / n));
    expect(Math.abs(variance - expectedVariance) / expectedVariance).toBeLessThan(0.03);
    expect(values.every((v) => v >= a && v <= b)).toBe(true);
  });

  it('puts the share (c−a)/(b−a) of the mass below the mode', () => {
    // Triangular CDF at the mode is (c−a)/(b−a): standard result.
    expect(triangularQuantile({ min: 2, mode: 5, max: 8 }, 0.5)).toBeCloseTo(5, 12);
    expect(triangularQuantile({ min: 0, mode: 1, max: 4 }, 0.25)).toBeCloseTo(1, 12);
  });

  it('maps u = 0 and u = 1 to the limits and is monotone in between', () => {
    // Any quantile function is non-decreasing and spans the support: definition of a CDF inverse.
    fc.assert(
      fc.property(
        fc.double({ min: -10, max: 10, noNaN: true }),
        fc.double({ min: 0, max: 5, noNaN: true }),
        fc.double({ min: 0, max: 5, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (min, toMode, toMax, u1, u2) => {
          const dist = { min, mode: min + toMode, max: min + toMode + toMax };
          const lo = triangularQuantile(dist, Math.min(u1, u2));
          const hi = triangularQuantile(dist, Math.max(u1, u2));
          expect(lo).toBeLessThanOrEqual(hi + 1e-12);
          expect(lo).toBeGreaterThanOrEqual(dist.min - 1e-12);
          expect(hi).toBeLessThanOrEqual(dist.max + 1e-12);
        },
      ),
    );
  });
});

describe('normal distribution helpers', () => {
  it('reproduces standard normal table values', () => {
    // Standard normal table: Φ(1.96) = 0.9750, Φ(1) = 0.8413, Φ⁻¹(0.975) = 1.95996 (from memory).
    expect(normalCdf(1.96)).toBeCloseTo(0.975, 4);
    expect(normalCdf(1)).toBeCloseTo(0.8413, 4);
    expect(normalCdf(0)).toBeCloseTo(0.5, 7);
    expect(normalQuantile(0.975)).toBeCloseTo(1.95996, 4);
    expect(normalQuantile(0.5)).toBeCloseTo(0, 9);
    expect(normalQuantile(0.001)).toBeCloseTo(-3.0902, 3);
  });

  it('stays finite at u = 0 and u → 1', () => {
    // The engine never returns Infinity (docs/model.md, Validation).
    expect(Number.isFinite(normalQuantile(0))).toBe(true);
    expect(Number.isFinite(normalQuantile(1))).toBe(true);
    expect(Number.isFinite(truncatedNormalQuantile({ mean: 1, sd: 0.1 }, 0))).toBe(true);
  });
});

describe('truncated normal distribution', () => {
  it('never leaves [min, max]', () => {
    // Definition of truncation: all mass inside [min, max].
    fc.assert(
      fc.property(
        fc.double({ min: -5, max: 5, noNaN: true }),
        fc.double({ min: 0.001, max: 3, noNaN: true }),
        fc.double({ min: -8, max: 8, noNaN: true }),
        fc.double({ min: 0, max: 4, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (mean, sd, min, width, u) => {
          const x = truncatedNormalQuantile({ mean, sd, min, max: min + width }, u);
          expect(x).toBeGreaterThanOrEqual(min);
          expect(x).toBeLessThanOrEqual(min + width);
        },
      ),
    );
  });

  it('has the untruncated mean when the bounds are symmetric', () => {
    // Truncating a normal symmetrically about its mean keeps the mean: standard result (symmetry).
    const random = createRandom(5);
    const dist = { mean: 1, sd: 0.1, min: 0.85, max: 1.15 };
    const values = Array.from({ length: 50_000 }, () => sampleTruncatedNormal(dist, random));
    expect(values.every((v) => v >= 0.85 && v <= 1.15)).toBe(true);
    expect(Math.abs(sampleMoments(values).mean - 1)).toBeLessThan(0.002);
  });

  it('has mean μ + σ√(2/π) when cut at the mean (half-normal)', () => {
    // Half-normal mean σ√(2/π) above the cut: standard result (e.g. Johnson, Kotz & Balakrishnan,
    // Continuous Univariate Distributions, vol. 1 — from memory).
    const random = createRandom(9);
    const dist = { mean: 2, sd: 0.5, min: 2 };
    const values = Array.from({ length: 100_000 }, () => sampleTruncatedNormal(dist, random));
    const expected = 2 + 0.5 * Math.sqrt(2 / Math.PI);
    expect(Math.abs(sampleMoments(values).mean - expected)).toBeLessThan(0.004);
  });

  it('follows the truncated-normal mean formula for a window far in the upper tail', () => {
    // Truncated normal mean μ + σ(φ(α) − φ(β))/(Φ(β) − Φ(α)): standard result (same source, from memory).
    const phi = (z: number): number => Math.exp(-z * z / 2) / Math.sqrt(2 * Math.PI);
    const alpha = 3;
    const beta = 4;
    // Φ(4) − Φ(3) = 0.0013182 from standard normal tables (Φ(3) = 0.998650, Φ(4) = 0.999968; from memory).
    const expected = (phi(alpha) - phi(beta)) / (0.999968 - 0.99865);
    const random = createRandom(3);
    const values = Array.from({ length: 50_000 }, () => sampleTruncatedNormal({ mean: 0, sd: 1, min: alpha, max: beta }, random));
    expect(values.every((v) => v >= alpha && v <= beta)).toBe(true);
    expect(sampleMoments(values).mean).toBeCloseTo(expected, 2);
  });

  it('returns the mean when the standard deviation is zero', () => {
    // A normal with σ = 0 is a point mass at μ: definition.
    expect(truncatedNormalQuantile({ mean: 1.1, sd: 0 }, 0.3)).toBe(1.1);
  });
});
