/**
 * The lender share in a real browser: the owner shares a version, the lender opens the captured
 * e-mail on the dev outbox page, signs up, sees the read-only scenario, downloads the workbook,
 * sets the status to "questions" with a note; the owner sees it. Expected behaviour: docs/product.md (Lender package) and docs/design.md ("Lender view: the same scenario read-only, with
 * the review notes beside it and the workbook a click away"). Screenshots at desktop
 * (1366×900) and tablet (820×1180) sizes are saved.
 */
import { readFileSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signInThroughForm, startBrowserHarness, type BrowserHarness } from '../helpers/browser.js';

const LENDER = { name: 'Ilse Marrow', email: 'credit.desk@bank-of-tessly.test', password: 'tessly-credit-2027' };
const NOTE = 'Please show the sand handling cost per stall against your current contractor rate.';
const DESKTOP = { width: 1366, height: 900 };
const TABLET = { width: 820, height: 1180 };

/** Polls with room for a busy machine (shared CI cores): the default 1 s is too tight here. */
const poll = <T>(fn: () => T | Promise<T>) => expect.poll(fn, { timeout: 20_000, interval: 100 });

describe('lender share in the browser', () => {
  let harness: BrowserHarness;
  let farmId: number;
  let scenarioId: number;
  let scenarioName: string;

  beforeAll(async () => {
    harness = await startBrowserHarness();
    const [farms] = (await harness.database.pool.query('SELECT id FROM farms WHERE name = ?', ['Cairnbrook Farm'])) as unknown as [{ id: number }[]];
    farmId = farms[0]!.id;
    // The demo scenario without a share: the owner shares it here.
    const [rows] = (await harness.database.pool.query(
      'SELECT s.id, s.name FROM scenarios s WHERE s.farm_id = ? AND NOT EXISTS (SELECT 1 FROM lender_shares l WHERE l.scenario_id = s.id)',
      [farmId],
    )) as unknown as [{ id: number; name: string }[]];
    scenarioId = rows[0]!.id;
    scenarioName = rows[0]!.name;
  }, 60_000);
  afterAll(async () => {
    await harness?.close();
  });

  it('goes from the owner’s share to the lender’s questions and back', async () => {
    // The owner shares the latest version from the scenario's Lender tab.
    const ownerContext = await harness.newContext(DESKTOP);
    const owner = await ownerContext.newPage();
    await signInThroughForm(owner, 'owner@byrecast.test');
    await owner.goto(`/farms/${farmId}/scenarios/${scenarioId}/lender`);
    await poll(() => owner.getByText('Not shared with a lender yet', { exact: false }).count()).toBe(1);
    await owner.getByRole('button', { name: 'Share with a lender' }).click();
    await owner.getByLabel('Lender’s e-mail').fill(LENDER.email);
    await harness.screenshot(owner, 'lender-share-dialog-desktop');
    await owner.getByRole('button', { name: 'Send the link' }).click();
    const row = owner.locator('table.shares tbody tr', { hasText: LENDER.email });
    await poll(() => row.count()).toBe(1);
    await poll(() => row.getByText('Link sent').count()).toBe(1);
    await harness.screenshot(owner, 'lender-tab-shared-desktop');

    // The lender opens the captured e-mail and signs up from the link.
    const lenderContext = await harness.newContext(DESKTOP);
    const lender = await lenderContext.newPage();
    await lender.goto('/dev/outbox');
    const mail = lender.locator('article.mail', { hasText: LENDER.email }).first();
    await poll(() => mail.count()).toBe(1);
    await mail.locator('a.mail-link[href*="/lender-shares/"]').first().click();
    await lender.waitForURL(/\/lender-shares\//);
    await poll(() => lender.getByText(scenarioName, { exact: false }).count()).toBeGreaterThan(0);
    await harness.screenshot(lender, 'lender-accept-desktop');
    await lender.getByLabel('Your name').fill(LENDER.name);
    await lender.locator('#password').fill(LENDER.password);
    await lender.getByRole('button', { name: 'Create account and open' }).click();
    await lender.waitForURL(new RegExp(`/farms/${farmId}/shared/${scenarioId}$`));

    // Read-only: the shared version with its comparison, no save or edit controls.
    await poll(() => lender.locator('[data-figure="shared-version"]').textContent()).toBe('1');
    await poll(() => lender.getByRole('heading', { name: 'Options compared' }).count()).toBe(1);
    expect(await lender.getByRole('button', { name: 'Save' }).count()).toBe(0);
    expect(await lender.locator('#scenario-name').count()).toBe(0);

    // The workbook is one click away.
    const [download] = await Promise.all([lender.waitForEvent('download'), lender.locator('a[data-action="workbook"]').click()]);
    expect(download.suggestedFilename()).toMatch(/_lender-workbook\.xlsx$/);
    const file = await download.path();
    // An XLSX file is a ZIP package: it starts with the local file header "PK\x03\x04" (ECMA-376 Part 2; APPNOTE.TXT 4.3.7).
    expect(readFileSync(file).subarray(0, 4).toString('latin1')).toBe('PK\x03\x04');

    // Status "questions" with a note.
    await lender.locator('.status-picker .p-select').click();
    await lender.getByRole('option', { name: 'Questions' }).click();
    await poll(() => lender.locator('[data-status="questions"]').count()).toBeGreaterThan(0);
    // The note is about one option and one of its lines.
    await lender.locator('.about-pickers .p-select').first().click();
    await lender.getByRole('option', { name: 'New barn, deep sand' }).click();
    await lender.locator('.about-pickers .p-select').nth(1).click();
    await lender.getByRole('option', { name: /^Capital: / }).first().click();
    await lender.getByPlaceholder('Your question or view').fill(NOTE);
    await lender.getByRole('button', { name: 'Add note' }).click();
    await poll(() => lender.locator('.thread', { hasText: NOTE }).count()).toBe(1);
    await poll(() => lender.locator('.thread .about').textContent()).toMatch(/New barn, deep sand › Capital: /);
    await lender.evaluate(() => window.scrollTo(0, 0));
    await harness.screenshot(lender, 'lender-view-desktop');
    await lender.setViewportSize(TABLET);
    await harness.screenshot(lender, 'lender-view-tablet');

    // The owner sees the status and the note, and the change in the audit log.
    await owner.reload();
    await poll(() => owner.locator('.review [data-status="questions"]').count()).toBeGreaterThan(0);
    await poll(() => owner.locator('.thread', { hasText: NOTE }).count()).toBe(1);
    await harness.screenshot(owner, 'lender-owner-sees-review-desktop');
    await owner.setViewportSize(TABLET);
    await harness.screenshot(owner, 'lender-owner-sees-review-tablet');
    await owner.setViewportSize(DESKTOP);
    await owner.getByRole('link', { name: 'Lender activity' }).click();
    await owner.waitForURL(new RegExp(`/farms/${farmId}/audit-log$`));
    for (const action of ['share.created', 'share.accepted', 'workbook.downloaded', 'review.status', 'note.added']) {
      await poll(() => owner.locator(`tr[data-action="${action}"]`).count()).toBe(1);
    }
    await harness.screenshot(owner, 'lender-audit-log-desktop');

    // The status change reached the owner by e-mail.
    await owner.goto('/dev/outbox');
    await poll(() => owner.locator('article.mail', { hasText: 'owner@byrecast.test' }).filter({ hasText: 'Questions' }).count()).toBe(1);
  }, 180_000);

  it('sends the demo lender from the members’ screens to what is shared with them', async () => {
    const context = await harness.newContext(TABLET);
    const page: Page = await context.newPage();
    await signInThroughForm(page, 'lender@byrecast.test');
    await page.goto(`/farms/${farmId}`);
    await page.waitForURL(new RegExp(`/farms/${farmId}/shared/\\d+$`));
    await poll(() => page.getByRole('heading', { name: 'Your review' }).count()).toBe(1);
    // The scenario not shared with them is not reachable through the workspace either.
    await page.goto(`/farms/${farmId}/scenarios/${scenarioId}`);
    await poll(() => page.getByText('not shared with you', { exact: false }).count()).toBe(1);
    await harness.screenshot(page, 'lender-not-shared-tablet');
  }, 120_000);
});
