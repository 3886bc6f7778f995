import { requireFinite, requirePositiveInteger } from './money';

export type RootResult = { value: number } | { value: null; reason: 'none-in-range' };

export type FindRootOptions = {
  /** Absolute tolerance on x; default 1e-12. */
  tolerance?: number;
  /** Iteration cap; default 200 (Brent falls back to bisection, so the bracket always shrinks). */
  maxIterations?: number;
};

const DEFAULT_TOLERANCE = 1e-12;
const DEFAULT_MAX_ITERATIONS = 200;

function evaluate(f: (x: number) => number, x: number): number {
  const y = f(x);
  if (!Number.isFinite(y)) {
    throw new RangeError(`findRoot: f(${x}) returned ${String(y)}; f must be finite on [lo, hi]`);
  }
  return y;
}

/**
 * Finds x in [lo, hi] with f(x) = 0 by Brent's method (inverse quadratic interpolation,
 * secant and bisection), unitless. Needs a bracket: f(lo) and f(hi) of opposite sign (or one
 * of them zero); otherwise `{ value: null, reason: 'none-in-range' }`.
 */
export function findRoot(
  f: (x: number) => number,
  lo: number,
  hi: number,
  options: FindRootOptions = {},
): RootResult {
  requireFinite('lo', lo);
  requireFinite('hi', hi);
  if (!(lo < hi)) throw new RangeError(`lo must be less than hi (got lo ${lo}, hi ${hi})`);
  const tolerance = options.tolerance ?? DEFAULT_TOLERANCE;
  requireFinite('tolerance', tolerance);
  if (tolerance <= 0) throw new RangeError(`tolerance must be > 0 (got ${tolerance})`);
  const maxIterations = options.maxIterations ?? DEFAULT_MAX_ITERATIONS;
  requirePositiveInteger('maxIterations', maxIterations);

  let a = lo;
  let b = hi;
  let fa = evaluate(f, a);
  let fb = evaluate(f, b);
  if (fa === 0) return { value: a };
  if (fb === 0) return { value: b };
  if (Math.sign(fa) === Math.sign(fb)) return { value: null, reason: 'none-in-range' };

  // Brent's method as laid out in Numerical Recipes (zbrent): b is the best estimate,
  // c the contrapoint keeping the root bracketed between b and c.
  let c = b;
  let fc = fb;
  let d = b - a;
  let e = d;
  for (let i = 0; i < maxIterations; i++) {
    if (Math.sign(fb) === Math.sign(fc)) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol1 = 2 * Number.EPSILON * Math.abs(b) + 0.5 * tolerance;
    const xm = 0.5 * (c - b);
    if (Math.abs(xm) <= tol1 || fb === 0) return { value: b };

    if (Math.abs(e) >= tol1 && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * xm * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p = s * (2 * xm * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      p = Math.abs(p);
      const min1 = 3 * xm * q - Math.abs(tol1 * q);
      const min2 = Math.abs(e * q);
      if (2 * p < Math.min(min1, min2)) {
        e = d;
        d = p / q;
      } else {
        d = xm;
        e = d;
      }
    } else {
      d = xm;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol1 ? d : Math.sign(xm) * tol1;
    fb = evaluate(f, b);
  }
  return { value: b };
}
