import { describe, expect, it } from 'vitest';
import { runMonteCarlo } from '@shared/engine';
import { pairedBins } from '../../../src/components/risk/histogram-bins';
import { handScenario } from '../engine/hand-scenario';

describe('the Monte Carlo histogram as drawn', () => {
  it('pairs adjacent bins: edges kept, counts added, an odd last bin left alone', () => {
    const bins = [
      { from: 0, to: 1, count: 3 },
      { from: 1, to: 2, count: 5 },
      { from: 2, to: 3, count: 0 },
      { from: 3, to: 4, count: 7 },
      { from: 4, to: 5, count: 2 },
    ];
    expect(pairedBins(bins)).toEqual([
      { from: 0, to: 2, count: 8 },
      { from: 2, to: 4, count: 7 },
      { from: 4, to: 5, count: 2 },
    ]);
    expect(pairedBins([])).toEqual([]);
  });

  it('keeps every draw of a real run in one bar over the same range', () => {
    const scenario = handScenario();
    const result = runMonteCarlo(scenario, { draws: 400, seed: 7, inputs: [{ key: 'milkPrice', distribution: 'triangular', min: 0.85, mode: 1, max: 1.1 }] });
    for (const option of result.options) {
      const bins = option.npv.histogram;
      const paired = pairedBins(bins);
      expect(paired).toHaveLength(Math.ceil(bins.length / 2));
      expect(paired.reduce((n, b) => n + b.count, 0)).toBe(result.drawsDone);
      expect(paired[0]?.from).toBe(bins[0]?.from);
      expect(paired.at(-1)?.to).toBe(bins.at(-1)?.to);
    }
  });
});
