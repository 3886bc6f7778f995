import type { Random } from './random';

/** Triangular distribution with lower limit `min`, peak `mode` and upper limit `max`. */
export interface Triangular {
  readonly min: number;
  readonly mode: number;
  readonly max: number;
}

/** Normal distribution with mean and standard deviation, optionally cut off at `min` / `max`. */
export interface TruncatedNormal {
  readonly mean: number;
  readonly sd: number;
  readonly min?: number | undefined;
  readonly max?: number | undefined;
}

/**
 * Inverse CDF of the triangular distribution at probability `u` ∈ [0, 1]; returns a value in
 * [min, max]. Needs min ≤ mode ≤ max (the schema checks it); a zero-width range returns min.
 */
export function triangularQuantile(dist: Triangular, u: number): number {
  const { min, mode, max } = dist;
  const width = max - min;
  if (!(width > 0)) return min;
  const modeFraction = (mode - min) / width;
  if (u < modeFraction) return min + Math.sqrt(u * width * (mode - min));
  return max - Math.sqrt((1 - u) * width * (max - mode));
}

/** One draw from a triangular distribution; consumes exactly one uniform. */
export function sampleTriangular(dist: Triangular, random: Random): number {
  return triangularQuantile(dist, random.next());
}

/**
 * Complementary error function, Chebyshev fit with fractional error below 1.2e-7 everywhere
 * (Press et al., Numerical Recipes, `erfcc`). Relative accuracy holds deep in the tail, which
 * is why the truncated normal works on the lower tail.
 */
function erfc(x: number): number {
  const z = Math.abs(x);
  const t = 1 / (1 + 0.5 * z);
  const r =
    t *
    Math.exp(
      -z * z -
        1.26551223 +
        t *
          (1.00002368 +
            t *
              (0.37409196 +
                t *
                  (0.09678418 +
                    t *
                      (-0.18628806 +
                        t *
                          (0.27886807 +
                            t *
                              (-1.13520398 +
                                t * (1.48851587 + t * (-0.82215223 + t * 0.17087277)))))))),
    );
  return x >= 0 ? r : 2 - r;
}

/** Standard normal CDF Φ(z). */
export function normalCdf(z: number): number {
  return 0.5 * erfc(-z / Math.SQRT2);
}

// Acklam's rational approximation of Φ⁻¹ (relative error below 1.15e-9).
const A = [-39.69683028665376, 220.9460984245205, -275.9285104469687, 138.357751867269, -30.66479806614716, 2.506628277459239] as const;
const B = [-54.47609879822406, 161.5858368580409, -155.6989798598866, 66.80131188771972, -13.28068155288572] as const;
const C = [-0.007784894002430293, -0.3223964580411365, -2.400758277161838, -2.549732539343734, 4.374664141464968, 2.938163982698783] as const;
const D = [0.007784695709041462, 0.3224671290700398, 2.445134137142996, 3.754408661907416] as const;
const P_LOW = 0.02425;
// Keeps Φ⁻¹ finite: a uniform of exactly 0 (probability 2⁻⁵³) would otherwise map to −∞.
const P_FLOOR = 1e-300;

/** Standard normal quantile Φ⁻¹(p) for p ∈ (0, 1); p is floored at 1e-300 so the result stays finite. */
export function normalQuantile(probability: number): number {
  const p = Math.min(Math.max(probability, P_FLOOR), 1 - Number.EPSILON / 2);
  if (p < P_LOW) {
    const q = Math.sqrt(-2 * Math.log(p));
    return (((((C[0] * q + C[1]) * q + C[2]) * q + C[3]) * q + C[4]) * q + C[5]) / ((((D[0] * q + D[1]) * q + D[2]) * q + D[3]) * q + 1);
  }
  if (p <= 1 - P_LOW) {
    const q = p - 0.5;
    const r = q * q;
    return ((((((A[0] * r + A[1]) * r + A[2]) * r + A[3]) * r + A[4]) * r + A[5]) * q) / (((((B[0] * r + B[1]) * r + B[2]) * r + B[3]) * r + B[4]) * r + 1);
  }
  const q = Math.sqrt(-2 * Math.log(1 - p));
  return -(((((C[0] * q + C[1]) * q + C[2]) * q + C[3]) * q + C[4]) * q + C[5]) / ((((D[0] * q + D[1]) * q + D[2]) * q + D[3]) * q + 1);
}

/**
 * Inverse CDF of the truncated normal at probability `u` ∈ [0, 1]: Φ⁻¹(Φ(α) + u·(Φ(β) − Φ(α)))
 * with α, β the standardised bounds. Returns a value in [min, max]; sd = 0 returns the mean
 * clamped to the bounds.
 */
export function truncatedNormalQuantile(dist: TruncatedNormal, u: number): number {
  const lower = dist.min ?? -Infinity;
  const upper = dist.max ?? Infinity;
  const clamp = (x: number): number => Math.min(Math.max(x, lower), upper);
  if (!(dist.sd > 0) || !(upper > lower)) return clamp(dist.mean);
  const alpha = (lower - dist.mean) / dist.sd;
  const beta = (upper - dist.mean) / dist.sd;
  // Φ loses relative precision near 1, so a window wholly above the mean is mirrored below it.
  const mirrored = alpha > 0;
  const a = mirrored ? -beta : alpha;
  const b = mirrored ? -alpha : beta;
  const cdfA = normalCdf(a);
  const z = normalQuantile(cdfA + u * (normalCdf(b) - cdfA));
  return clamp(dist.mean + dist.sd * (mirrored ? -z : z));
}

/** One draw from a (truncated) normal distribution; consumes exactly one uniform. */
export function sampleTruncatedNormal(dist: TruncatedNormal, random: Random): number {
  return truncatedNormalQuantile(dist, random.next());
}
