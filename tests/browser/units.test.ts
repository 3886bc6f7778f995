import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { KG_PER_CWT, KG_PER_LB } from '../../shared/units.js';
import { signInThroughForm, startBrowserHarness, type BrowserHarness } from '../helpers/browser.js';

describe('a farm switched to US customary units, in Chromium', () => {
  let harness: BrowserHarness;
  beforeAll(async () => {
    harness = await startBrowserHarness();
  });
  afterAll(async () => {
    await harness?.close();
  });

  it('shows lb and the price per cwt while the stored SI values stay exactly as they were', async () => {
    const context = await harness.newContext();
    const page = await context.newPage();
    await signInThroughForm(page, 'owner@byrecast.test');
    const farms = (await (await page.request.get('/api/farms')).json()) as { id: number; name: string }[];
    const farmId = farms.find((f) => f.name === 'Cairnbrook Farm')!.id;
    const before = (await (await page.request.get(`/api/farms/${farmId}/baseline`)).json()) as {
      units: string;
      herd: { yieldKgPerCowDay: number; milkPricePerKg: number };
    };
    expect(before.units).toBe('metric');

    await page.goto(`/farms/${farmId}/baseline`);
    await page.getByText('US customary (lb, ft, US gal, cwt)').click();
    await page.getByRole('button', { name: 'Save herd and markets' }).click();
    await expect
      .poll(async () => ((await (await page.request.get(`/api/farms/${farmId}/baseline`)).json()) as { units: string }).units)
      .toBe('us');
    await harness.screenshot(page, 'baseline-us-units');

    await page.goto(`/farms/${farmId}`);
    const summary = page.locator('main');
    await expect.poll(() => summary.innerText()).toContain('lb/cow/day');
    const text = await summary.innerText();
    // 1 lb = 0.45359237 kg and 1 cwt = 100 lb (NIST Handbook 44 definitions, from memory).
    const yieldLb = (before.herd.yieldKgPerCowDay / KG_PER_LB).toFixed(1);
    const pricePerCwt = (before.herd.milkPricePerKg * KG_PER_CWT).toFixed(2);
    expect(text).toContain(`${yieldLb} lb/cow/day`);
    expect(text).toMatch(new RegExp(`€${pricePerCwt.replace('.', '\\.')} per cwt`));
    await harness.screenshot(page, 'farm-home-us-units');

    // Display follows the farm's units; what is stored does not move (round trip exact).
    const after = (await (await page.request.get(`/api/farms/${farmId}/baseline`)).json()) as typeof before;
    expect(after.herd).toEqual(before.herd);
    await context.close();
  });
});
