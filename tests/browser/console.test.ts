/**
 * A clean console: every screen a farm owner or a loan officer opens on the demo farm loads
 * without a console error and without a failed API request. "Nothing saved yet" (no Monte
 * Carlo result kept, no preference) is an answer, never an error.
 */
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signInThroughForm, startBrowserHarness, type BrowserHarness } from '../helpers/browser.js';

interface Trouble {
  screen: string;
  what: string;
}

/** Records console errors and API answers ≥ 400 while `visit` runs each screen. */
function watch(page: Page): { troubles: Trouble[]; answered: string[]; at: (screen: string) => void } {
  const troubles: Trouble[] = [];
  const answered: string[] = [];
  let screen = '';
  page.on('console', (message) => {
    if (message.type() === 'error') troubles.push({ screen, what: message.text() });
  });
  page.on('pageerror', (error) => troubles.push({ screen, what: String(error) }));
  page.on('response', (response) => {
    if (response.url().includes('/api/')) answered.push(`${response.status()} ${new URL(response.url()).pathname}`);
    if (response.url().includes('/api/') && response.status() >= 400) troubles.push({ screen, what: `${response.status()} ${response.url()}` });
  });
  return { troubles, answered, at: (name) => (screen = name) };
}

async function visitAll(page: Page, paths: string[], at: (screen: string) => void): Promise<void> {
  for (const path of paths) {
    at(path);
    await page.goto(path);
    await page.waitForLoadState('networkidle');
    await page.locator('main').waitFor();
  }
}

describe('a clean console on every screen', () => {
  let harness: BrowserHarness;
  let farmId: number;
  let scenarioIds: number[];
  let sharedId: number;

  beforeAll(async () => {
    harness = await startBrowserHarness();
    const pool = harness.database.pool;
    const [farms] = (await pool.query('SELECT id FROM farms WHERE name = ?', ['Cairnbrook Farm'])) as unknown as [{ id: number }[]];
    farmId = farms[0]!.id;
    const [scenarios] = (await pool.query('SELECT id FROM scenarios WHERE farm_id = ? ORDER BY id', [farmId])) as unknown as [{ id: number }[]];
    scenarioIds = scenarios.map((s) => s.id);
    const [shares] = (await pool.query('SELECT scenario_id AS id FROM lender_shares LIMIT 1')) as unknown as [{ id: number }[]];
    sharedId = shares[0]!.id;
  }, 60_000);
  afterAll(async () => {
    await harness?.close();
  });

  it('shows the owner every screen without a console error, before any risk run is kept', async () => {
    const context = await harness.newContext();
    const page = await context.newPage();
    const { troubles, answered, at } = watch(page);
    await signInThroughForm(page, 'owner@byrecast.test');
    const farm = `/farms/${farmId}`;
    const screens = [farm, `${farm}/baseline`, `${farm}/documents`, `${farm}/members`, `${farm}/audit-log`, `${farm}/milk-records/import`, '/profile', '/farms'];
    for (const id of scenarioIds) {
      const s = `${farm}/scenarios/${id}`;
      screens.push(s, `${s}/results`, `${s}/compare`, `${s}/risk`, `${s}/lender`, `${s}/print`, `${s}/versions`);
    }
    await visitAll(page, screens, at);
    expect(troubles).toEqual([]);
    // The risk and print screens did ask for the kept run, and were told "none yet" without an error.
    expect(answered).toContain(`200 /api/farms/${farmId}/scenarios/${scenarioIds[0]}/risk-result`);
    await context.close();
  });

  it('shows the consultant every farm screen without a console error, the owner-only lender activity as a refusal', async () => {
    // docs/product.md (roles): the lender activity is the owner's; the client asks the same
    // permission table (shared/permissions.ts) before it fetches, so no refused request is logged.
    const context = await harness.newContext();
    const page = await context.newPage();
    const { troubles, at } = watch(page);
    await signInThroughForm(page, 'consultant@byrecast.test');
    const farm = `/farms/${farmId}`;
    await visitAll(page, [farm, `${farm}/baseline`, `${farm}/documents`, `${farm}/members`, `${farm}/audit-log`, `${farm}/scenarios/${scenarioIds[0]}/lender`], at);
    expect(troubles).toEqual([]);
    await page.goto(`${farm}/audit-log`);
    await page.getByTestId('audit-refused').waitFor();
    expect(await page.getByRole('link', { name: 'Lender activity' }).count()).toBe(0);
    await context.close();
  });

  it('shows the loan officer the shared scenario without a console error', async () => {
    const context = await harness.newContext();
    const page = await context.newPage();
    const { troubles, at } = watch(page);
    await signInThroughForm(page, 'lender@byrecast.test');
    await visitAll(page, [`/farms/${farmId}/shared/${sharedId}`, `/farms/${farmId}/scenarios/${sharedId}/print`], at);
    expect(troubles).toEqual([]);
    await context.close();
  });
});
