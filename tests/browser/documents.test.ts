/**
 * Documents and milk records in Chromium, as the farm owner: upload a quote to a capital line,
 * give it an amount, see it listed and download it; import a milk-record file, see the refused
 * rows, confirm, and see the herd baseline change. Behaviour from docs/product.md (Documents and milk records).
 */
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserHarness, signInThroughForm, type BrowserHarness } from '../helpers/browser.js';
import { expectedSummary, generateMilkCsv } from '../helpers/milk-csv.js';
import { pdfBytes, sha256 } from '../helpers/uploads.js';

describe('documents and milk records in Chromium', () => {
  let harness: BrowserHarness;
  beforeAll(async () => {
    harness = await startBrowserHarness();
  });
  afterAll(async () => {
    await harness?.close();
  });

  it('uploads a quote to a capital line, sets its amount, lists it, downloads it and deletes it', async () => {
    const context = await harness.newContext();
    const page = await context.newPage();
    await signInThroughForm(page, 'owner@byrecast.test');
    const farms = (await (await page.request.get('/api/farms')).json()) as { id: number }[];
    const farmId = farms[0]?.id ?? 0;
    const scenarios = (await (await page.request.get(`/api/farms/${farmId}/scenarios`)).json()) as { id: number }[];
    const scenario = scenarios[0];
    let lineLabel = 'Farm';
    let quotedLineId = '';
    if (scenario) {
      const doc = (await (await page.request.get(`/api/farms/${farmId}/scenarios/${scenario.id}`)).json()) as {
        scenario: { options: { current: boolean; capitalLines: { id: string; description: string }[] }[] };
      };
      // A line of the first option that is not the current one: the one the capital table opens on.
      const line = doc.scenario.options.find((o) => !o.current)?.capitalLines[0];
      expect(line, 'the demo scenario has a capital line').toBeDefined();
      lineLabel = line?.description ?? '';
      quotedLineId = line?.id ?? '';
      await page.goto(`/farms/${farmId}/documents?scenarioId=${scenario.id}&capitalLineId=${encodeURIComponent(line?.id ?? '')}`);
      await expect.poll(() => page.getByRole('heading', { level: 2 }).first().textContent()).toContain(lineLabel);
    } else {
      // The scenario screens are not there yet: the quote goes on the farm.
      await page.goto(`/farms/${farmId}/documents`);
    }
    await expect.poll(() => page.getByText('No documents yet').isVisible()).toBe(true);
    await harness.screenshot(page, 'documents-empty');

    const bytes = pdfBytes(120_000);
    await page.getByLabel('File to upload').setInputFiles({ name: 'steel-frame quote.pdf', mimeType: 'application/pdf', buffer: bytes });
    const link = page.getByRole('link', { name: 'steel-frame quote.pdf' });
    await link.waitFor();
    const row = page.getByRole('row', { name: /steel-frame quote\.pdf/ });
    expect(await row.textContent()).toContain('PDF');
    expect(await row.textContent()).toContain(lineLabel);

    if (scenario) {
      const amount = page.getByLabel('Quote amount for steel-frame quote.pdf');
      await amount.click();
      await amount.pressSequentially('182450');
      await amount.press('Tab');
      await page.getByRole('status').filter({ hasText: 'Saved' }).waitFor();
      const quoted = page.getByRole('list', { name: 'Capital lines with quotes' });
      await expect.poll(() => quoted.textContent()).toContain('Quoted');
      expect(await quoted.textContent()).toMatch(/182,450\.00/);
    }
    await harness.screenshot(page, 'documents-quote-listed');

    if (scenario) {
      // The capital table tells the quoted line from the estimates.
      const docsUrl = page.url();
      await page.goto(`/farms/${farmId}/scenarios/${scenario.id}`);
      await page.getByRole('tab', { name: 'Capital' }).click();
      const rows = page.locator('tr[data-line-id]');
      await rows.first().waitFor();
      const quotedLine = page.locator(`tr[data-line-id="${quotedLineId}"] [data-backing]`);
      await expect.poll(() => quotedLine.textContent()).toMatch(/Quote €182,450\b/);
      expect(await page.locator('[data-backing="estimate"]').count()).toBeGreaterThan(0);
      await harness.screenshot(page, 'capital-table-quote');
      await page.goto(docsUrl);
      await link.waitFor();
    }

    const [download] = await Promise.all([page.waitForEvent('download'), link.click()]);
    expect(download.suggestedFilename()).toBe('steel-frame quote.pdf');
    const saved = await download.path();
    expect(sha256(readFileSync(saved))).toBe(sha256(bytes));

    await page.getByRole('button', { name: 'Delete steel-frame quote.pdf' }).click();
    await page.getByRole('button', { name: 'Delete', exact: true }).click();
    await expect.poll(() => page.getByText('No documents yet').isVisible()).toBe(true);
  });

  it('imports a milk-record file, shows the refused rows, confirms and shows the new herd baseline', async () => {
    const context = await harness.newContext();
    const page = await context.newPage();
    await signInThroughForm(page, 'owner@byrecast.test');
    const farms = (await (await page.request.get('/api/farms')).json()) as { id: number }[];
    const farmId = farms[0]?.id ?? 0;
    await page.goto(`/farms/${farmId}/milk-records/import`);
    const cows = page.getByTestId('baseline-cows');
    await cows.waitFor();
    const cowsBefore = await cows.textContent();

    const { text, records } = generateMilkCsv({ cows: 142, days: 60, intervalDays: 10, delimiter: ';', bom: true });
    const expected = expectedSummary(records, 1);
    expect(String(expected.herdSize)).not.toBe(cowsBefore);
    const bad = ['C00001;2026-13-01;30', 'C00002;2026-03-05;-3', 'C00003;2026-03-04;28'];
    const file = `${text}${bad.join('\r\n')}\r\n`;
    await page.getByLabel('Milk-record file').setInputFiles({ name: 'spring-tests.csv', mimeType: 'text/csv', buffer: Buffer.from(file) });

    const refused = page.getByRole('table', { name: 'Refused rows' });
    await refused.waitFor();
    const refusedText = (await refused.textContent()) ?? '';
    expect(refusedText).toContain('bad date');
    expect(refusedText).toContain('negative milk');
    expect(refusedText).toContain('duplicate row');
    expect(await page.getByTestId('preview-herd').textContent()).toBe(`${expected.herdSize} cows`);
    await harness.screenshot(page, 'milk-import-preview');

    await page.getByRole('button', { name: 'Set the herd baseline' }).click();
    await page.getByText('Herd baseline updated').waitFor();
    await expect.poll(() => cows.textContent()).toBe(String(expected.herdSize));
    const yieldText = (await page.getByTestId('baseline-yield').textContent()) ?? '';
    expect(Number(yieldText.split(' ')[0])).toBeCloseTo(expected.averageKg, 1);
    expect(await page.getByRole('table').last().textContent()).toContain('spring-tests.csv');
    await harness.screenshot(page, 'milk-import-confirmed');
  });
});
