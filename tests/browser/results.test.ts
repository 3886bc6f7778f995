/**
 * Results and comparison in Chromium: the numbers on screen are the engine's to the cent (checked
 * against `npm run evaluate -- --json` for the same file), no chart code before a chart is
 * shown, and screenshots of results, comparison and print view at desktop and tablet sizes.
 */
import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import type { Page, Request } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { OptionResult, ScenarioResults } from '../../shared/engine/results.js';
import { measureByKey, MEASURES } from '../../src/components/compare/ranking.js';
import { parseFormatted } from '../../src/composables/useFormat.js';
import { signInThroughForm, startBrowserHarness, type BrowserHarness } from '../helpers/browser.js';

const SCENARIO_FILE = 'scenarios/cairnbrook-five-systems.json';
const DESKTOP = { width: 1366, height: 900 };
const TABLET = { width: 820, height: 1180 };

/** The engine's results for the demo file, from the command line the README documents. */
function evaluateFromCli(): ScenarioResults {
  const run = spawnSync('npm', ['run', '-s', 'evaluate', '--', SCENARIO_FILE, '--json'], { encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 });
  if (run.status !== 0) throw new Error(`npm run evaluate failed: ${run.stderr}`);
  return JSON.parse(run.stdout) as ScenarioResults;
}

/** Imports the demo scenario into the signed-in user's farm unless the seed already holds it; returns its URL base. */
async function openDemoScenario(page: Page): Promise<string> {
  const farms = (await (await page.request.get('/api/farms')).json()) as { id: number }[];
  const farmId = farms[0]?.id;
  if (!farmId) throw new Error('the demo owner has no farm');
  const document = JSON.parse(readFileSync(SCENARIO_FILE, 'utf8')) as { name: string };
  const list = (await (await page.request.get(`/api/farms/${farmId}/scenarios`)).json()) as { id: number; name: string }[];
  let id = list.find((s) => s.name === document.name)?.id;
  if (!id) {
    const created = await page.request.post(`/api/farms/${farmId}/scenarios`, { data: { scenario: document } });
    expect(created.status()).toBe(201);
    id = ((await created.json()) as { id: number }).id;
  }
  return `/farms/${farmId}/scenarios/${id}`;
}

/** Screen text must never show NaN, Infinity or undefined. */
async function expectNoBrokenNumbers(page: Page): Promise<void> {
  const text = await page.locator('main').innerText();
  expect(text).not.toMatch(/NaN|Infinity|undefined/);
}

const isChartCode = (request: Request): boolean => /\/assets\/charts-[^/]+\.js$/.test(request.url()) || request.url().includes('apexcharts');

describe('results and comparison in Chromium', () => {
  let harness: BrowserHarness;
  let engine: ScenarioResults;
  let base = '';

  beforeAll(async () => {
    harness = await startBrowserHarness();
    engine = evaluateFromCli();
  });
  afterAll(async () => {
    await harness?.close();
  });

  it('loads no chart code on the first screen after sign-in', async () => {
    const context = await harness.newContext(DESKTOP);
    const page = await context.newPage();
    const requests: string[] = [];
    page.on('request', (request) => {
      if (isChartCode(request)) requests.push(request.url());
    });
    await signInThroughForm(page, 'owner@byrecast.test');
    await page.waitForLoadState('networkidle');
    expect(requests).toEqual([]);
    base = await openDemoScenario(page);
    await context.close();
  });

  it('shows every comparison figure exactly as the engine computes it, to the cent', async () => {
    const context = await harness.newContext(DESKTOP);
    const page = await context.newPage();
    const chartRequests: string[] = [];
    page.on('request', (request) => {
      if (isChartCode(request)) chartRequests.push(request.url());
    });
    await signInThroughForm(page, 'owner@byrecast.test');
    await page.goto(`${base}/compare`);
    const table = page.getByTestId('comparison-table');
    await table.waitFor();

    expect(engine.options).toHaveLength(5);
    let checked = 0;
    for (const option of engine.options) {
      for (const measure of MEASURES) {
        const cell = table.locator(`tr[data-measure="${measure.key}"] td[data-option-id="${option.id}"]`);
        const text = (await cell.innerText()).trim();
        const expected = measure.value(option as OptionResult);
        if (expected === null) {
          // docs/model.md: a metric that cannot be computed is null with a reason, never a number.
          expect(text, `${option.id} ${measure.key}`).toMatch(/^(not defined|not in \d+ yr|no stalls|no debt|no extra outlay|—)/);
          continue;
        }
        const shown = parseFormatted(text, 'en-IE');
        expect(shown, `${option.id} ${measure.key}: "${text}"`).not.toBeNull();
        // Same value as `npm run evaluate -- --json` at the precision shown: cents for money, 0.1 % for rates.
        const digits = { money: 2, percent: 3, years: 1, ratio: 2, hours: 0, tonnes: 1 }[measure.kind];
        const scale = measure.kind === 'percent' ? 100 : 1;
        // Within half a unit of the last digit shown (the screen rounds half away from zero, toFixed on the binary value).
        const halfStep = 0.5 * 10 ** -digits;
        expect(Math.abs((shown ?? 0) / scale - expected), `${option.id} ${measure.key}: "${text}" vs ${expected}`).toBeLessThanOrEqual(halfStep + 1e-9);
        checked += 1;
      }
    }
    expect(checked).toBeGreaterThan(40);
    // Currency in the farm's locale (en-IE euros: "€1,234.56", CLDR via Intl, from memory).
    expect(await table.locator('tr[data-measure="npv"] td').first().innerText()).toMatch(/^−?€\d{1,3}(,\d{3})*\.\d{2}$/);

    // The charts arrive as their own chunk once the comparison is shown.
    await page.locator('.apexcharts-canvas').first().waitFor();
    expect(chartRequests.some((url) => /\/assets\/charts-/.test(url))).toBe(true);
    await page.waitForTimeout(300);
    await expectNoBrokenNumbers(page);
    await harness.screenshot(page, 'compare-desktop');

    // The current option is the reference the others are measured against, not a candidate: marked, never ranked (docs/product.md glossary).
    const reference = table.locator('th[data-option-id="grazing"]');
    await expect.poll(() => reference.innerText()).toContain('current option');
    expect(await reference.locator('.rank').innerText()).toBe('reference');
    expect(await reference.innerText()).not.toMatch(/#\d/);
    // The candidates are ranked 1, 2, … by the NPV of their change, best first, as the farm page names the best.
    const candidates = engine.options.filter((o) => !o.current);
    const ranks = await table.locator('thead th[data-option-id] .rank').evaluateAll((cells) => cells.map((c) => c.textContent?.trim()));
    expect(ranks).toEqual(['reference', ...candidates.map((_, i) => `#${i + 1}`)]);
    await context.close();
  });

  it('ranks the options by the measure the user picks', async () => {
    const context = await harness.newContext(DESKTOP);
    const page = await context.newPage();
    await signInThroughForm(page, 'owner@byrecast.test');
    await page.goto(`${base}/compare`);
    const table = page.getByTestId('comparison-table');
    await table.waitFor();
    await page.getByRole('combobox', { name: 'Rank options by' }).click();
    await page.getByRole('option', { name: 'Capital per stall' }).click();
    const measure = measureByKey('capitalPerStall');
    const order = await table.locator('thead th[data-option-id]').evaluateAll((cells) => cells.map((c) => c.getAttribute('data-option-id')));
    const expected = engine.options
      .filter((o) => !o.current && measure.value(o) !== null)
      .sort((a, b) => (measure.value(a) ?? 0) - (measure.value(b) ?? 0))
      .map((o) => o.id);
    // The current option stays first as the reference; lower capital per stall ranks first (common practice, no source); options without stalls go last.
    expect(order[0]).toBe(engine.currentOptionId);
    expect(order.slice(1, 1 + expected.length)).toEqual(expected);
    await context.close();
  });

  it('shows results with readings, the projection and the loan schedule, without NaN', async () => {
    const context = await harness.newContext(DESKTOP);
    const page = await context.newPage();
    await signInThroughForm(page, 'owner@byrecast.test');
    await page.goto(`${base}/results`);
    await page.locator('[data-metric="npv"]').waitFor();
    const sand = engine.options.find((o) => o.id === 'sand-freestall');
    await page.getByRole('combobox', { name: 'Option' }).click();
    await page.getByRole('option', { name: 'Sand-bedded freestall' }).click();
    await expect.poll(() => page.locator('[data-metric="npv"] .value').innerText()).toBe(
      new Intl.NumberFormat('en-IE', { style: 'currency', currency: 'EUR' }).format(sand?.npv ?? 0).replace('-', '\u2212'),
    );
    // The change leads: payback from operations alone (no salvage or herd value at the end), then the own figures.
    const payback = await page.locator('[data-metric="inc-payback-operations"] .reading').innerText();
    expect(payback).toMatch(/pays the outlay back in year \d+ of 20|not paid back from operations/);
    expect(await page.locator('[data-metric="npv"] dt').innerText()).toMatch(/whole herd's margin/);
    // The lender's stress table: base case and the six shocks, the threshold named.
    await expect.poll(() => page.locator('[data-testid="stress-table"] tbody tr').count()).toBe(7);
    expect(await page.getByTestId('stress-table').innerText()).toContain('1.25');
    expect(await page.getByTestId('sources-and-uses').innerText()).toMatch(/Total uses[\s\S]*Total sources/);
    // The cautions the option's choices raise sit beside its figures, as on the Build screen and in
    // print (shared/cautions.ts): sand bedding in slurry, moving a pasture herd indoors, permits, bought-in cows.
    const cautions = page.getByTestId('results-cautions').locator('[data-caution]');
    expect(await cautions.evaluateAll((items) => items.map((li) => li.getAttribute('data-caution')))).toEqual(['sandInSlurry', 'movingIndoors', 'permits', 'biosecurity']);
    // docs/model.md "Housing and expansion": the barn with today's 190 cows apart from the 40 cows it adds, the engine's figures.
    const split = sand?.incremental?.split;
    expect(split).toBeTruthy();
    const whole = (value: number) =>
      new Intl.NumberFormat('en-IE', { style: 'currency', currency: 'EUR', minimumFractionDigits: 0, maximumFractionDigits: 0 }).format(value).replace(/-/g, '\u2212');
    const splitText = await page.getByTestId('expansion-split').innerText();
    expect(splitText).toContain("Housing, today's herd (190 cows)");
    expect(splitText).toContain('Expansion: 40 added cows by year 20');
    expect(await page.getByTestId('split-housing').locator('td').first().innerText()).toBe(whole(split?.housingTodaysHerd.npv ?? NaN));
    expect(await page.getByTestId('split-expansion').locator('td').first().innerText()).toBe(whole(split?.expansion.npv ?? NaN));
    // The demo enters the costs every cow carries besides feed, so no note says the added cows' part is overstated.
    expect(await page.getByTestId('split-no-herd-costs').count()).toBe(0);
    expect(await page.locator('[data-metric="coverage"] .reading').innerText()).toMatch(/coverage lowest in year \d+ at \d\.\d\d — (below|at or above) the lender's 1\.25|no debt service/);
    // The yearly and loan tables are drawn when they come near the screen, as the reader scrolls to them.
    await page.locator('.results-view .tables').scrollIntoViewIfNeeded();
    await page.getByRole('row', { name: /Milk income/ }).first().waitFor();
    // The long tables grow with the page: no box of their own scrolls up and down, so the cash
    // flow lines at the bottom and the loan's later years are read by scrolling the page.
    const tables = page.locator('.results-view .tables');
    const innerScrollers = await tables.evaluate((root) =>
      [...root.querySelectorAll('*')].filter((e) => /(auto|scroll)/.test(getComputedStyle(e).overflowY) && e.scrollHeight > e.clientHeight + 1).map((e) => e.className),
    );
    expect(innerScrollers).toEqual([]);
    expect(await tables.getByRole('row', { name: /Cash flow after the loan/ }).first().isVisible()).toBe(true);
    expect(await tables.locator('.loan-table tbody tr').last().isVisible()).toBe(true);
    await expectNoBrokenNumbers(page);
    await harness.screenshot(page, 'results-desktop');

    // The first loan year opens to its monthly payments.
    await page.locator('.loan-table .p-datatable-row-toggle-button, .loan-table button[aria-label*="Expand"], .loan-table .p-row-toggler').first().click();
    await expect.poll(() => page.locator('table.payments tbody tr').count()).toBe(12);
    await context.close();
  });

  it('fits results and comparison on a tablet', async () => {
    const context = await harness.newContext(TABLET);
    const page = await context.newPage();
    await signInThroughForm(page, 'owner@byrecast.test');
    await page.goto(`${base}/results`);
    await page.locator('[data-metric="npv"]').waitFor();
    await expectNoBrokenNumbers(page);
    await harness.screenshot(page, 'results-tablet');
    await page.goto(`${base}/compare`);
    await page.locator('.apexcharts-canvas').first().waitFor();
    await page.waitForTimeout(300);
    await expectNoBrokenNumbers(page);
    // Nothing sticks out sideways: the page itself never scrolls horizontally.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(TABLET.width);
    await harness.screenshot(page, 'compare-tablet');
    await context.close();
  });

  it('prints the comparison cleanly on A4 and US Letter, with the cautions and without navigation', async () => {
    const context = await harness.newContext(DESKTOP);
    const page = await context.newPage();
    await signInThroughForm(page, 'owner@byrecast.test');
    await page.goto(`${base}/print`);
    await page.getByTestId('comparison-table').waitFor();
    await page.locator('.apexcharts-canvas').first().waitFor();
    await expect.poll(() => page.locator('main').innerText()).toContain('never enter a manure pit');
    // The demo's barns raise the option cautions too: sand in the slurry and moving the grazing herd indoors.
    const printed = await page.locator('.cautions').innerText();
    expect(printed).toContain('never enter a pit or tank');
    expect(printed).toContain('vet and hoof trimmer');
    await expectNoBrokenNumbers(page);
    await harness.screenshot(page, 'print-screen-desktop');

    await page.emulateMedia({ media: 'print' });
    expect(await page.locator('.top-bar').isVisible()).toBe(false);
    expect(await page.getByRole('button', { name: 'Print' }).isVisible()).toBe(false);
    for (const [format, widthMm] of [
      ['A4', 210],
      ['Letter', 215.9],
    ] as const) {
      // Printable width: paper width less the 12 mm side margins of the @page rule, at 96 px per inch.
      const printable = Math.floor(((widthMm - 24) / 25.4) * 96);
      await page.setViewportSize({ width: printable, height: 1100 });
      await page.waitForTimeout(300);
      const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
      expect(overflow, `${format}: content wider than the page`).toBeLessThanOrEqual(0);
      await harness.screenshot(page, `print-${format.toLowerCase()}`);
      const pdf = await page.pdf({ format, printBackground: true, preferCSSPageSize: true });
      expect(pdf.subarray(0, 4).toString()).toBe('%PDF');
    }
    await context.close();
  });
});
