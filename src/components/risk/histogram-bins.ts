import type { OptionMonteCarloResult } from '@shared/engine';

/** One bin of a Monte Carlo NPV histogram: values in [from, to) (currency) and how many draws fell there. */
export type HistogramBin = OptionMonteCarloResult['npv']['histogram'][number];

/**
 * Adjacent bins merged in pairs (counts added, so every draw is still in one bar; an odd last bin
 * stays as it is): half the bars and axis labels for the chart to lay out, which keeps drawing a
 * finished run's histogram under one long task.
 */
export function pairedBins(bins: readonly HistogramBin[]): HistogramBin[] {
  const paired: HistogramBin[] = [];
  for (let i = 0; i < bins.length; i += 2) {
    const first = bins[i] as HistogramBin;
    const second = bins[i + 1];
    paired.push(second ? { from: first.from, to: second.to, count: first.count + second.count } : first);
  }
  return paired;
}
