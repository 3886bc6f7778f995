/**
 * The option cards and the finance form in Chromium: each card gives the kept Monte Carlo run's
 * chance that the change loses money (or says the risk is not run yet, or out of date), and the
 * existing farm's loans and herd margin are edited on the finance form, saved through the
 * scenario save, and move whole-farm coverage on the cards exactly as the engine computes it.
 */
import { readFileSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { evaluateScenario } from '../../shared/engine/evaluate.js';
import { runMonteCarlo } from '../../shared/engine/risk/monte-carlo.js';
import { scenarioSchema, type Scenario } from '../../shared/schema/index.js';
import { formatNumber, formatPercent } from '../../src/composables/useFormat.js';
import { signInThroughForm, startBrowserHarness, type BrowserHarness } from '../helpers/browser.js';

const SCENARIO_FILE = 'scenarios/cairnbrook-five-systems.json';
const DESKTOP = { width: 1366, height: 900 };
const PHONE = { width: 390, height: 844 };
const until = expect.poll;

function demoDocument(): Scenario {
  return scenarioSchema.parse(JSON.parse(readFileSync(SCENARIO_FILE, 'utf8')));
}

/** Creates a copy of the demo scenario under `name` in the owner's farm; returns ids and the Build URL. */
async function createCopy(page: Page, name: string): Promise<{ farmId: number; scenarioId: number; version: number; url: string }> {
  const farms = (await (await page.request.get('/api/farms')).json()) as { id: number }[];
  const farmId = farms[0]?.id;
  if (!farmId) throw new Error('the demo owner has no farm');
  const created = await page.request.post(`/api/farms/${farmId}/scenarios`, { data: { scenario: { ...demoDocument(), name } } });
  expect(created.status()).toBe(201);
  const body = (await created.json()) as { id: number; version: number };
  return { farmId, scenarioId: body.id, version: body.version, url: `/farms/${farmId}/scenarios/${body.id}` };
}

const card = (page: Page, optionId: string) => page.locator(`.option-card[data-option-id="${optionId}"]`);
const cardFigure = (page: Page, optionId: string, label: string) => card(page, optionId).locator('.figures div', { hasText: label }).locator('dd');

describe('option cards and the existing farm on the finance form', () => {
  let harness: BrowserHarness;
  beforeAll(async () => {
    harness = await startBrowserHarness();
  });
  afterAll(async () => {
    await harness?.close();
  });

  it('shows the kept run’s chance of loss on each card, "risk not run yet" before, "out of date" after an edit', async () => {
    const context = await harness.newContext(DESKTOP);
    const page = await context.newPage();
    await signInThroughForm(page, 'owner@byrecast.test');
    const copy = await createCopy(page, 'Cards with a kept risk run');
    const demo = demoDocument();
    const candidates = demo.options.filter((o) => !o.current);

    // Read once the page has asked for the kept run (the card would say the same while it waits).
    const asked = page.waitForResponse((response) => response.url().endsWith('/risk-result'));
    await page.goto(copy.url);
    expect((await asked).status()).toBe(200);
    for (const option of candidates) {
      await until(() => cardFigure(page, option.id, 'Chance the change loses money').innerText(), { timeout: 10_000 }).toBe('risk not run yet');
    }
    // The current option is the reference: its card has no chance of loss of its own.
    const current = demo.options.find((o) => o.current);
    expect(await cardFigure(page, current?.id ?? '', 'Chance the change loses money').count()).toBe(0);

    // A run kept with the scenario, as the Risk tab keeps one (the shared core, seeded; fewer draws for speed).
    const result = runMonteCarlo(demo, { ...demo.risk.monteCarlo, draws: 400 });
    const kept = await page.request.put(`/api/farms/${copy.farmId}/scenarios/${copy.scenarioId}/risk-result`, { data: { scenarioVersion: copy.version, result } });
    expect(kept.status()).toBe(200);
    await page.reload();
    let shown = 0;
    for (const option of candidates) {
      const p = result.options.find((o) => o.optionId === option.id)?.incrementalNpv?.probabilityNegative;
      expect(p, option.id).toBeTypeOf('number');
      // The same figure the Risk tab's table shows for the kept run (one decimal, the farm's locale).
      await until(() => cardFigure(page, option.id, 'Chance the change loses money').innerText(), { timeout: 10_000 }).toBe(formatPercent(p ?? NaN, 'en-IE', 1));
      shown += 1;
    }
    expect(shown).toBe(4);
    await harness.screenshot(page, 'cards-risk-kept-desktop');

    // The same on a phone: the cards stack and nothing sticks out sideways.
    const phone = await harness.newContext(PHONE);
    const small = await phone.newPage();
    await signInThroughForm(small, 'owner@byrecast.test');
    await small.goto(copy.url);
    await until(() => cardFigure(small, candidates[0]?.id ?? '', 'Chance the change loses money').innerText(), { timeout: 10_000 }).toMatch(/%$/);
    expect(await small.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
    await harness.screenshot(small, 'cards-risk-kept-phone');
    await phone.close();

    // An unsaved edit makes the kept run describe other inputs.
    await page.getByRole('tab', { name: 'Herd and markets' }).click();
    await page.locator('#field-herd-milkPricePerKg').fill('0.5');
    await page.getByRole('tab', { name: 'Options' }).click();
    await until(() => cardFigure(page, candidates[0]?.id ?? '', 'Chance the change loses money').innerText()).toBe('risk run out of date');
    // Saved, the kept run still describes the inputs before: it stays out of date (not shown as current).
    await page.getByRole('button', { name: 'Save', exact: true }).click();
    await until(() => page.getByText(`Version ${copy.version + 1} is saved.`).count()).toBe(1);
    await until(() => cardFigure(page, candidates[0]?.id ?? '', 'Chance the change loses money').innerText(), { timeout: 10_000 }).toBe('risk run out of date');
    await context.close();
  });

  it('edits existing loans and the herd margin on the finance form, refuses bad input by name, saves, reloads and moves whole-farm coverage', async () => {
    const context = await harness.newContext(DESKTOP);
    const page = await context.newPage();
    await signInThroughForm(page, 'owner@byrecast.test');
    const copy = await createCopy(page, 'Existing loans on the finance form');
    const demo = demoDocument();
    const before = evaluateScenario(demo);

    await page.goto(`${copy.url}?section=finance`);
    await page.getByRole('heading', { name: 'Existing loans that end within the horizon' }).waitFor();
    await page.getByRole('button', { name: 'Add existing loan' }).click();
    const row = page.getByTestId('existing-loan').first();
    await row.getByLabel('Loan', { exact: true }).fill('');
    const payment = page.locator('#field-herd-existingLoans-0-paymentPerYear');
    await payment.fill('-5');
    // The shared schema's rule, beside the field and named by the label shown there (src/api/messages.ts inlineMessage).
    await until(() => row.innerText()).toContain('Payment per year must be at least 0');
    await until(() => row.innerText()).toContain('Existing loan description must not be empty');
    await row.getByLabel('Loan', { exact: true }).fill('Tractor loan');
    await payment.fill('30000');
    await page.locator('#field-herd-existingLoans-0-lastYear').fill('8');
    const margin = page.locator('#field-herd-existingCashHerdMarginPerYear');
    const enteredMargin = (demo.herd.existingCashHerdMarginPerYear ?? 0) + 40_000;
    await margin.fill(String(enteredMargin));
    await until(() => row.innerText()).not.toContain('must');
    await harness.screenshot(page, 'finance-existing-loans-desktop');
    await page.setViewportSize(PHONE);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
    await harness.screenshot(page, 'finance-existing-loans-phone');
    await page.setViewportSize(DESKTOP);

    await page.getByRole('button', { name: 'Save', exact: true }).click();
    await until(() => page.getByText(`Version ${copy.version + 1} is saved.`).count()).toBe(1);

    // Saved through the scenario save: the stored document holds both.
    const stored = (await (await page.request.get(`/api/farms/${copy.farmId}/scenarios/${copy.scenarioId}`)).json()) as { scenario: Scenario };
    expect(stored.scenario.herd.existingLoans).toEqual([{ description: 'Tractor loan', paymentPerYear: 30_000, lastYear: 8 }]);
    expect(stored.scenario.herd.existingCashHerdMarginPerYear).toBe(enteredMargin);

    await page.reload();
    await page.getByRole('heading', { name: 'Existing loans that end within the horizon' }).waitFor();
    // Inputs group thousands as the farm's locale writes them (en-IE "30,000", CLDR via Intl, from memory).
    await until(() => page.locator('#field-herd-existingLoans-0-paymentPerYear').inputValue()).toBe('30,000');
    expect(await page.locator('#field-herd-existingLoans-0-lastYear').inputValue()).toBe('8');
    expect(await page.getByTestId('existing-loan').first().getByLabel('Loan', { exact: true }).inputValue()).toBe('Tractor loan');

    // Whole-farm coverage on every card is the engine's for the saved document, and lower than before:
    // the loan adds 30 000 of debt in years 1–8 and the larger herd margin leaves less cash beside the herd.
    const after = evaluateScenario(stored.scenario);
    await page.getByRole('tab', { name: 'Options' }).click();
    for (const option of after.options) {
      const was = before.options.find((o) => o.id === option.id)?.lowestCoverage?.value ?? NaN;
      const now = option.lowestCoverage?.value ?? NaN;
      expect(now, option.id).toBeLessThan(was);
      await until(() => cardFigure(page, option.id, 'Lowest whole-farm coverage').innerText()).toBe(formatNumber(now, 'en-IE', 2, true));
    }
    await harness.screenshot(page, 'cards-after-existing-loans-desktop');

    // Removing the loan and clearing the margin gives back the current option's own year-1 figure.
    await page.getByRole('tab', { name: 'Finance' }).click();
    await page.getByRole('button', { name: 'Remove Tractor loan' }).click();
    await page.locator('#field-herd-existingCashHerdMarginPerYear').fill('');
    const auto = evaluateScenario({ ...stored.scenario, herd: { ...stored.scenario.herd, existingLoans: [], existingCashHerdMarginPerYear: null } });
    // Shown in whole units once the live evaluation has run on the cleared field.
    const placeholderAmount = async (): Promise<number> => Number(((await page.locator('#field-herd-existingCashHerdMarginPerYear').getAttribute('placeholder')) ?? '').replace(/[^\d.-]/g, ''));
    await until(placeholderAmount).toBe(Math.round(auto.existingFarm.herdMarginInExistingCash));
    await context.close();
  });
});
