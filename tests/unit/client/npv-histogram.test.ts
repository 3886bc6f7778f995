// @vitest-environment jsdom
/**
 * The Monte Carlo NPV histogram as drawn (src/components/risk/npv-histogram.ts and
 * NpvHistogram.vue). Expected positions are worked by hand from a linear scale over the bins'
 * range; the round axis steps (1, 2, 2.5, 5 times a power of ten) are common practice, no source.
 */
import { mount } from '@vue/test-utils';
import PrimeVue from 'primevue/config';
import { describe, expect, it } from 'vitest';
import { runMonteCarlo, type OptionMonteCarloResult } from '@shared/engine';
import NpvHistogram from '@/components/risk/NpvHistogram.vue';
import { histogramLayout, niceStep } from '@/components/risk/npv-histogram';
import { handScenario } from '../engine/hand-scenario';

// Four bins of €100 000 from −€200 000 to €200 000 holding 10, 30, 40 and 20 of 100 draws.
const bins = [
  { from: -200_000, to: -100_000, count: 10 },
  { from: -100_000, to: 0, count: 30 },
  { from: 0, to: 100_000, count: 40 },
  { from: 100_000, to: 200_000, count: 20 },
];
// 1 SVG unit per €1 000: x = 250 + NPV / 1000.
const box = { left: 50, top: 20, width: 400, height: 200 };

describe('histogram layout', () => {
  it('makes bar heights proportional to each bin’s share of the draws', () => {
    const { bars, yTicks } = histogramLayout(bins, box, 2);
    expect(bars.map((b) => b.share)).toEqual([0.1, 0.3, 0.4, 0.2]);
    // The axis tops out at 40 % (the largest share, a round step): 200 units tall = 40 %.
    [50, 150, 200, 100].forEach((height, i) => expect(bars[i]?.height).toBeCloseTo(height, 9));
    for (const bar of bars) expect(bar.y + bar.height).toBeCloseTo(box.top + box.height, 9);
    expect(yTicks.map((t) => t.share)).toEqual([0, 0.1, 0.2, 0.3, 0.4]);
    [220, 170, 120, 70, 20].forEach((y, i) => expect(yTicks[i]?.y).toBeCloseTo(y, 9));
  });

  it('spans each bar over its bin with a gap on both sides', () => {
    const { bars } = histogramLayout(bins, box, 2);
    bars.forEach((bar, i) => {
      const slotStart = 50 + 100 * i;
      expect(bar.x).toBeGreaterThan(slotStart);
      expect(bar.x + bar.width).toBeLessThan(slotStart + 100);
      expect(bar.x - slotStart).toBeCloseTo(slotStart + 100 - (bar.x + bar.width), 9);
    });
  });

  it('puts the break-even line at NPV 0, and leaves it out when no draw is near it', () => {
    expect(histogramLayout(bins, box).zeroX).toBe(250);
    // −€50 000 … €350 000: zero is an eighth of the way along.
    const shifted = bins.map((b) => ({ ...b, from: b.from + 150_000, to: b.to + 150_000 }));
    expect(histogramLayout(shifted, box).zeroX).toBe(100);
    const allGain = bins.map((b) => ({ ...b, from: b.from + 300_000, to: b.to + 300_000 }));
    expect(histogramLayout(allGain, box).zeroX).toBeNull();
  });

  it('labels bin centres spread evenly from the first bin to the last', () => {
    expect(histogramLayout(bins, box, 2).xLabels).toEqual([
      { value: -150_000, x: 100 },
      { value: 150_000, x: 400 },
    ]);
    expect(histogramLayout(bins, box, 4).xLabels.map((l) => l.value)).toEqual([-150_000, -50_000, 50_000, 150_000]);
    // More labels asked than bins: one a bin.
    expect(histogramLayout(bins, box, 9).xLabels).toHaveLength(4);
  });

  it('draws nothing for no bins', () => {
    expect(histogramLayout([], box)).toEqual({ bars: [], yTicks: [], xLabels: [], zeroX: null });
  });

  it('keeps every draw of a real run in one bar, over the plot’s whole width', () => {
    const result = runMonteCarlo(handScenario(), { draws: 400, seed: 7, inputs: [{ key: 'milkPrice', distribution: 'triangular', min: 0.85, mode: 1, max: 1.1 }] });
    for (const option of result.options) {
      const { bars, yTicks } = histogramLayout(option.npv.histogram, box);
      expect(bars.reduce((n, b) => n + b.count, 0)).toBe(result.drawsDone);
      expect(bars.reduce((n, b) => n + b.share, 0)).toBeCloseTo(1, 12);
      expect(bars[0]!.x).toBeGreaterThanOrEqual(box.left);
      expect(bars.at(-1)!.x + bars.at(-1)!.width).toBeLessThanOrEqual(box.left + box.width);
      // No bar rises above the axis's top tick.
      expect(Math.min(...bars.map((b) => b.y))).toBeGreaterThanOrEqual(yTicks.at(-1)!.y);
    }
  });
});

describe('round axis steps', () => {
  it.each([
    [0.4, 0.1],
    [0.093, 0.025],
    [0.22, 0.1],
    [0.03, 0.01],
    [1, 0.25],
  ])('about four steps up to %s: %s', (max, step) => {
    expect(niceStep(max)).toBeCloseTo(step, 12);
  });
});

describe('NpvHistogram', () => {
  const distribution: OptionMonteCarloResult['npv'] = { histogram: bins, probabilityNegative: 0.4, mean: 10_000, p10: -120_000, p50: 12_500, p90: 150_000 };
  const render = () =>
    mount(NpvHistogram, {
      props: { title: 'How the runs spread', caption: 'Share of 100 runs (%) in each NPV band.', distribution, colour: '#0072B2', format: { locale: 'en-IE', currency: 'EUR' } },
      global: { plugins: [PrimeVue] },
    });

  it('is one image with a summary a screen reader reads', () => {
    const svg = render().get('svg');
    expect(svg.attributes('role')).toBe('img');
    const label = svg.attributes('aria-label');
    expect(label).toContain('100 draws, NPV from −€200,000 to €200,000');
    expect(label).toContain('40.0% of draws below NPV 0');
    expect(label).toContain('middle draw (P50) €12,500');
    expect(svg.get('title').text()).toBe(label);
  });

  it('gives each bar its band and share as a tooltip, in the option’s colour', () => {
    const wrapper = render();
    const tips = wrapper.findAll('.bar > title').map((t) => t.text());
    expect(tips).toEqual([
      '−€200,000 to −€100,000: 10.0% of draws (10)',
      '−€100,000 to €0: 30.0% of draws (30)',
      '€0 to €100,000: 40.0% of draws (40)',
      '€100,000 to €200,000: 20.0% of draws (20)',
    ]);
    expect(wrapper.get('.bars').attributes('fill')).toBe('#0072B2');
  });

  it('marks and labels NPV 0, and labels both axes', () => {
    const wrapper = render();
    // jsdom lays nothing out, so the default 640 wide: plot from 48 to 626, zero in its middle.
    const zero = wrapper.get('[data-testid="npv-zero"]');
    expect(Number(zero.get('line').attributes('x1'))).toBeCloseTo(48 + 578 / 2, 9);
    expect(zero.get('text').text()).toBe('NPV 0');
    expect(wrapper.findAll('.grid text').map((t) => t.text())).toEqual(['0', '10', '20', '30', '40']);
    expect(wrapper.findAll('.x-labels text').map((t) => t.text())).toEqual(['−€150.0K', '−€50.0K', '€50.0K', '€150.0K', 'NPV (bin centre)']);
    expect(wrapper.text()).toContain('Share of draws (%)');
  });

  it('shows the bands as a table on request', async () => {
    const wrapper = render();
    await wrapper.get('button').trigger('click');
    expect(wrapper.find('svg').exists()).toBe(false);
    const rows = wrapper.findAll('tbody tr').map((r) => r.findAll('th, td').map((c) => c.text()));
    expect(rows[2]).toEqual(['€0 to €100,000', '40', '40.0%']);
    expect(rows).toHaveLength(4);
  });
});
