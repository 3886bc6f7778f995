/**
 * Percentile of already sorted values, `fraction` ∈ [0, 1] (0.1 for P10). Definition: linear
 * interpolation between order statistics, h = (n − 1)·fraction, x⌊h⌋ + (h − ⌊h⌋)(x⌊h⌋₊₁ − x⌊h⌋)
 * — numpy's default `percentile(..., method='linear')`, spreadsheets' PERCENTILE.INC.
 * Returns null for no values.
 */
export function percentileSorted(sorted: ArrayLike<number>, fraction: number): number | null {
  const n = sorted.length;
  if (n === 0) return null;
  const h = (n - 1) * Math.min(Math.max(fraction, 0), 1);
  const below = Math.floor(h);
  const lowerValue = sorted[below] as number;
  if (below + 1 >= n) return lowerValue;
  const upperValue = sorted[below + 1] as number;
  return lowerValue + (h - below) * (upperValue - lowerValue);
}

/** Percentile of values in any order (same definition as {@link percentileSorted}); does not reorder the input. */
export function percentile(values: ArrayLike<number>, fraction: number): number | null {
  return percentileSorted(sortedCopy(values), fraction);
}

/** Ascending numeric copy (a Float64Array sorts numerically, unlike Array.prototype.sort's default). */
export function sortedCopy(values: ArrayLike<number>): Float64Array {
  return Float64Array.from(values).sort();
}

/** Arithmetic mean; null for no values. */
export function mean(values: ArrayLike<number>): number | null {
  const n = values.length;
  if (n === 0) return null;
  let sum = 0;
  for (let i = 0; i < n; i += 1) sum += values[i] as number;
  return sum / n;
}

/** One histogram bin: values in [from, to), the last bin also holding `to`. */
export interface HistogramBin {
  readonly from: number;
  readonly to: number;
  readonly count: number;
}

/**
 * Equal-width histogram over [min, max] of the values, numpy's `histogram` convention: bins are
 * half-open except the last, which is closed; when all values are equal the range is widened
 * to value ± 0.5. No values → no bins.
 */
export function histogram(values: ArrayLike<number>, binCount: number): HistogramBin[] {
  const n = values.length;
  const bins = Math.max(1, Math.floor(binCount));
  if (n === 0) return [];
  let low = Infinity;
  let high = -Infinity;
  for (let i = 0; i < n; i += 1) {
    const v = values[i] as number;
    if (v < low) low = v;
    if (v > high) high = v;
  }
  if (low === high) {
    low -= 0.5;
    high += 0.5;
  }
  const span = high - low;
  const width = span / bins;
  const counts = new Array<number>(bins).fill(0);
  for (let i = 0; i < n; i += 1) {
    // Dividing by the span before scaling keeps subnormal-wide ranges from dividing by a zero width.
    const position = Math.floor((((values[i] as number) - low) / span) * bins);
    const index = Math.min(bins - 1, Math.max(0, position || 0));
    counts[index] = (counts[index] ?? 0) + 1;
  }
  return counts.map((count, i) => ({
    from: low + i * width,
    to: i === bins - 1 ? high : low + (i + 1) * width,
    count,
  }));
}
