/**
 * The risk screen in Chromium: a 20 000-draw Monte Carlo in the Web Worker shows progress, can be
 * cancelled, and run again with the same seed gives the same P50 as the shared core computes
 * here in Node. How long the main thread is blocked while it runs and while its result is drawn
 * is measured in `npm run bench` (tests/bench/browser.ts), not here: timing has no place in a test.
 */
import { readFileSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runMonteCarlo } from '../../shared/engine/risk/monte-carlo.js';
import { RISK_INPUT_LABELS, scenarioSchema } from '../../shared/schema/index.js';
import { sensitivityInputKeys } from '../../shared/schema/risk-keys.js';
import { signInThroughForm, startBrowserHarness, type BrowserHarness } from '../helpers/browser.js';

const SCENARIO_FILE = 'scenarios/cairnbrook-five-systems.json';
const DRAWS = 20_000;
const SEED = 20261201;

async function openDemoScenario(page: Page): Promise<string> {
  const farms = (await (await page.request.get('/api/farms')).json()) as { id: number }[];
  const farmId = farms[0]?.id;
  const document = JSON.parse(readFileSync(SCENARIO_FILE, 'utf8')) as { name: string };
  const list = (await (await page.request.get(`/api/farms/${farmId}/scenarios`)).json()) as { id: number; name: string }[];
  let id = list.find((s) => s.name === document.name)?.id;
  if (!id) {
    const created = await page.request.post(`/api/farms/${farmId}/scenarios`, { data: { scenario: document } });
    id = ((await created.json()) as { id: number }).id;
  }
  return `/farms/${farmId}/scenarios/${id}`;
}

/** Records the moment the progress bar reaches 100 %: the worker has stopped. */
function observeDone(): void {
  const done = window as unknown as { __mcDoneAt: number[] };
  done.__mcDoneAt = [];
  new MutationObserver((mutations) => {
    for (const m of mutations) {
      const el = m.target as Element;
      if (el.getAttribute('data-testid') === 'mc-progress' && el.getAttribute('aria-valuenow') === '100') done.__mcDoneAt.push(performance.now());
    }
  }).observe(document, { subtree: true, attributes: true, attributeFilter: ['aria-valuenow'] });
}

const progressValue = (page: Page): Promise<number> =>
  page.getByTestId('mc-progress').getAttribute('aria-valuenow').then((v) => Number(v ?? 0));

describe('risk screen in Chromium', () => {
  let harness: BrowserHarness;
  beforeAll(async () => {
    harness = await startBrowserHarness();
  });
  afterAll(async () => {
    await harness?.close();
  });

  it('runs a seeded Monte Carlo in a worker with progress and cancel, matching the shared core', async () => {
    const context = await harness.newContext({ width: 1366, height: 900 });
    await context.addInitScript(observeDone);
    const page = await context.newPage();
    await signInThroughForm(page, 'owner@byrecast.test');
    const base = await openDemoScenario(page);
    await page.goto(`${base}/risk`);
    await page.getByTestId('sensitivity-table').waitFor();
    // The demo scenario ships with the family's uncertain inputs (scenarios/).
    const scenario = scenarioSchema.parse(JSON.parse(readFileSync(SCENARIO_FILE, 'utf8')));
    const inputs = scenario.risk.monteCarlo.inputs;
    expect(inputs.length).toBeGreaterThan(0);
    await expect.poll(() => page.getByTestId('mc-input').count()).toBe(inputs.length);
    // The seed and the distributions sit under the "advanced" fold.
    await page.getByTestId('mc-settings-advanced').locator('summary').click();
    await page.locator('#mc-draws').fill(String(DRAWS));
    await page.locator('#mc-seed').fill(String(SEED));
    await page.locator('#mc-seed').blur();
    // Let the edits' own re-evaluation settle before the run.
    await page.waitForTimeout(1500);

    await page.getByTestId('mc-run').click();
    await expect.poll(() => progressValue(page), { timeout: 60_000 }).toBeGreaterThan(0);
    const first = await progressValue(page);
    await expect.poll(() => progressValue(page), { timeout: 60_000 }).toBeGreaterThan(first);
    await page.getByTestId('mc-cancel').click();
    await expect.poll(() => page.locator('.monte-carlo').innerText()).toContain('cancelled');
    expect(await progressValue(page)).toBeLessThan(100);
    // Let the partial result render before the second run starts.
    await page.waitForTimeout(1500);

    const secondStart = await page.evaluate(() => performance.now());
    await page.getByTestId('mc-run').click();
    await expect.poll(() => progressValue(page), { timeout: 240_000, interval: 250 }).toBe(100);
    // The bar reached 100 % after the second Run click.
    expect(await page.evaluate((after) => (window as unknown as { __mcDoneAt: number[] }).__mcDoneAt.some((t) => t >= after), secondStart)).toBe(true);
    await page.getByTestId('mc-run').waitFor({ timeout: 30_000 });
    const shown = await page.getByTestId('mc-p50').evaluateAll((cells) =>
      cells.map((cell) => ({ optionId: cell.closest('tr')?.getAttribute('data-option-id') ?? '', p50: Number(cell.getAttribute('data-value')) })),
    );
    await page.getByTestId('npv-histogram').locator('svg').waitFor();
    // The same seed and settings in the shared core here in Node (docs/product.md: the same P50 as the
    // server, to the cent). Chromium's and Node's Math functions may differ in the last binary digit.
    const expected = runMonteCarlo(scenario, { draws: DRAWS, seed: SEED, inputs: inputs.map((i) => ({ ...i })) });
    expect(shown).toHaveLength(expected.options.length);
    for (const option of expected.options) {
      const p50 = shown.find((s) => s.optionId === option.optionId)?.p50;
      expect(option.npv.p50, option.optionId).not.toBeNull();
      expect(p50, option.optionId).toBeCloseTo(option.npv.p50 ?? Number.NaN, 2);
    }
    // The histogram shows the first candidate's change against the current option: a bar per bin,
    // and the break-even line exactly when its range holds NPV 0.
    const change = expected.options.find((o) => !o.current)?.incrementalNpv?.histogram ?? [];
    const histogram = page.getByTestId('npv-histogram');
    expect(await histogram.locator('.bar').count()).toBe(change.length);
    expect(await histogram.getByTestId('npv-zero').count()).toBe((change[0]?.from ?? 0) <= 0 && (change.at(-1)?.to ?? 0) >= 0 ? 1 : 0);
    expect(await histogram.locator('svg').getAttribute('aria-label')).toMatch(/draws below NPV 0/);
    await page.waitForTimeout(300);
    const text = await page.locator('main').innerText();
    expect(text).not.toMatch(/NaN|Infinity|undefined/);
    await harness.screenshot(page, 'risk-desktop');
    await context.close();
  }, 420_000);

  it('fits the risk screen on a tablet', async () => {
    const context = await harness.newContext({ width: 820, height: 1180 });
    const page = await context.newPage();
    await signInThroughForm(page, 'owner@byrecast.test');
    const base = await openDemoScenario(page);
    await page.goto(`${base}/risk`);
    await page.getByTestId('sensitivity-table').waitFor();
    await page.locator('.sensitivity .apexcharts-canvas').waitFor();
    await page.waitForTimeout(300);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(820);
    expect(await page.locator('main').innerText()).not.toMatch(/NaN|Infinity|undefined/);
    // The sensitivity lists the lying-time milk once, as the response (docs/model.md, Risk): no range to edit for the gain.
    const table = page.getByTestId('sensitivity-table');
    const rows = await table.locator('tbody th[scope="row"]').allInnerTexts();
    expect([...rows].sort()).toEqual(sensitivityInputKeys.map((key) => RISK_INPUT_LABELS[key]).sort());
    expect(rows).not.toContain(RISK_INPUT_LABELS.lyingHours);
    expect(await table.getByRole('spinbutton', { name: new RegExp(`^${RISK_INPUT_LABELS.lyingHours}`) }).count()).toBe(0);
    expect(await table.locator('input').count()).toBe(2 * sensitivityInputKeys.length);
    await harness.screenshot(page, 'risk-tablet');
    await context.close();
  });
});
