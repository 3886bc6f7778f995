import type { OptionMonteCarloResult } from '@shared/engine';

/** One bin of a Monte Carlo NPV histogram: values in [from, to) (currency) and how many draws fell there. */
export type HistogramBin = OptionMonteCarloResult['npv']['histogram'][number];

/** The plot area inside the SVG, in SVG units (the axes' labels sit outside it). */
export interface PlotBox {
  left: number;
  top: number;
  width: number;
  height: number;
}

/** A bin as drawn: its share of all draws (0..1) and its rectangle. */
export interface HistogramBar extends HistogramBin {
  share: number;
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface HistogramLayout {
  bars: HistogramBar[];
  /** Gridlines of the share axis, from 0 to the top of the axis. */
  yTicks: { share: number; y: number }[];
  /** The bin centres labelled on the NPV axis, spread evenly over the bins. */
  xLabels: { value: number; x: number }[];
  /** Where NPV = 0 lies on the x axis, or null when no draw is near break-even. */
  zeroX: number | null;
}

/** Share of the bar's slot left empty beside it, so neighbouring bars read apart. */
const BAR_GAP = 0.12;

/** A round step (1, 2, 2.5 or 5 times a power of ten) giving about `ticks` steps up to `max`. */
export function niceStep(max: number, ticks = 4): number {
  if (!(max > 0)) return 1;
  const raw = max / ticks;
  const magnitude = 10 ** Math.floor(Math.log10(raw));
  const multiple = [1, 2, 2.5, 5, 10].find((m) => m * magnitude >= raw * (1 - 1e-9)) ?? 10;
  return multiple * magnitude;
}

/**
 * Bars, axis ticks and the break-even line of an NPV histogram in `box`: bar heights in
 * proportion to each bin's share of the draws, NPV on a linear x axis over the bins' range,
 * `labelCount` bin centres labelled.
 */
export function histogramLayout(bins: readonly HistogramBin[], box: PlotBox, labelCount = 5): HistogramLayout {
  const first = bins[0];
  const last = bins.at(-1);
  if (!first || !last) return { bars: [], yTicks: [], xLabels: [], zeroX: null };
  const low = first.from;
  const span = last.to - low || 1;
  const xOf = (value: number): number => box.left + ((value - low) / span) * box.width;
  const total = bins.reduce((n, b) => n + b.count, 0);
  const shares = bins.map((b) => (total > 0 ? b.count / total : 0));
  const step = niceStep(Math.max(...shares));
  const top = step * Math.max(1, Math.ceil(Math.max(...shares) / step - 1e-9));
  const yOf = (share: number): number => box.top + box.height * (1 - share / top);

  const bars = bins.map((bin, i) => {
    const slot = xOf(bin.to) - xOf(bin.from);
    const share = shares[i] ?? 0;
    const y = yOf(share);
    return { ...bin, share, x: xOf(bin.from) + (slot * BAR_GAP) / 2, width: slot * (1 - BAR_GAP), y, height: box.top + box.height - y };
  });
  const yTicks = Array.from({ length: Math.round(top / step) + 1 }, (_, i) => {
    const share = Number((i * step).toPrecision(12));
    return { share, y: yOf(share) };
  });
  const count = Math.min(bins.length, Math.max(1, labelCount));
  const picked = count === 1 ? [Math.floor((bins.length - 1) / 2)] : Array.from({ length: count }, (_, k) => Math.round((k * (bins.length - 1)) / (count - 1)));
  const xLabels = picked.map((i) => {
    const bin = bins[i] as HistogramBin;
    const value = (bin.from + bin.to) / 2;
    return { value, x: xOf(value) };
  });
  return { bars, yTicks, xLabels, zeroX: low <= 0 && last.to >= 0 ? xOf(0) : null };
}
