/**
 * The screens a family and a bank read, in Chromium: errors in plain words named as the forms
 * name the field, save held back while an input holds no number, number styles chosen by country,
 * source tags that follow edits and quotes (on screen and in the workbook), a first scenario that
 * says why its barns lose money, and a capital table with nothing cut off. docs/design.md
 * ("Habits", "Numbers") and docs/product.md (Documents, Lender package).
 */
import ExcelJS from 'exceljs';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signInThroughForm, startBrowserHarness, type BrowserHarness } from '../helpers/browser.js';
import { pdfBytes } from '../helpers/uploads.js';

const DESKTOP = { width: 1366, height: 900 };
const PHONE = { width: 390, height: 844 };

function until<T>(read: () => T | Promise<T>) {
  return expect.poll(read, { timeout: 15_000, interval: 100 });
}

interface ScenarioDoc {
  scenario: { options: { id: string; name: string; current: boolean; capitalLines: { id: string; kind: string; description: string; unit?: string }[] }[] };
}

async function ownerPage(harness: BrowserHarness, viewport = DESKTOP): Promise<{ page: Page; farmId: number }> {
  const context = await harness.newContext(viewport);
  const page = await context.newPage();
  await signInThroughForm(page, 'owner@byrecast.test');
  const farms = (await (await page.request.get('/api/farms')).json()) as { id: number; name: string }[];
  return { page, farmId: farms.find((farm) => farm.name === 'Cairnbrook Farm')?.id ?? farms[0]?.id ?? 0 };
}

/** Select labels whose text does not fit their box (shown with "…"). */
async function cutSelectLabels(page: Page, scope: string): Promise<string[]> {
  return page.evaluate(
    (selector) =>
      [...document.querySelectorAll(`${selector} .p-select-label`)]
        .filter((label) => label.scrollWidth > label.clientWidth + 1)
        .map((label) => label.textContent ?? ''),
    scope,
  );
}

describe('words and formats on the screens a family and a bank read', () => {
  let harness: BrowserHarness;
  beforeAll(async () => {
    harness = await startBrowserHarness();
  });
  afterAll(async () => {
    await harness?.close();
  });

  it('a first scenario says why its barns lose money, links to the inputs, and will not save text that is not a number', async () => {
    const { page, farmId } = await ownerPage(harness);
    const created = (await (await page.request.post(`/api/farms/${farmId}/scenarios`, { data: { name: 'First look', startingPoint: 'grazing' }, headers: { origin: harness.url } })).json()) as { id: number };
    await page.goto(`/farms/${farmId}/scenarios/${created.id}`);
    await page.getByRole('button', { name: 'Add option' }).first().click();
    const dialog = page.getByRole('dialog');
    // The dialog steers to no barn: nothing chosen, nothing to add until the user picks.
    expect(await dialog.locator('input[type=radio]:checked').count()).toBe(0);
    expect(await dialog.getByRole('button', { name: 'Add option' }).isDisabled()).toBe(true);
    await dialog.getByLabel(/Sand-bedded freestall/).check();
    await dialog.getByRole('button', { name: 'Add option' }).click();

    const hint = page.locator('[data-hint="missing-gains"]');
    await until(() => hint.isVisible()).toBe(true);
    const text = (await hint.textContent()) ?? '';
    expect(text).toContain('add no cows and no milk');
    expect(text).toContain('Sand-bedded freestall');
    // The NPV beside the name is the live results strip's own figure.
    const stripNpv = await page.locator('.results-strip .strip-option').nth(1).locator('[data-figure="change"] dd.num').textContent();
    expect(text).toContain((stripNpv ?? 'missing').trim());
    await harness.screenshot(page, 'words-first-scenario-hint-desktop');

    await hint.getByRole('button', { name: 'Added cows' }).click();
    await until(() => page.evaluate(() => document.activeElement?.id)).toBe('field-options-1-herdChange-addedCows');
    await page.keyboard.type('4x');
    const save = page.getByRole('button', { name: 'Save', exact: true });
    await until(() => save.isDisabled()).toBe(true);
    expect(await page.locator('.unparsed-hint').textContent()).toContain('Added cows from year 1');
    await harness.screenshot(page, 'words-unparsed-save-desktop');
    await page.keyboard.press('Backspace');
    await until(() => save.isDisabled()).toBe(false);

    const phone = await ownerPage(harness, PHONE);
    await phone.page.goto(`/farms/${farmId}/scenarios/${created.id}`);
    // The phone sees the saved scenario: one option so far, so no hint; add the same barn.
    await phone.page.getByRole('button', { name: 'Add option' }).first().click();
    await phone.page.getByRole('dialog').getByLabel(/Sand-bedded freestall/).check();
    await phone.page.getByRole('dialog').getByRole('button', { name: 'Add option' }).click();
    await until(() => phone.page.locator('[data-hint="missing-gains"]').isVisible()).toBe(true);
    await harness.screenshot(phone.page, 'words-first-scenario-hint-phone');
  });

  it('refuses a bad figure with the field named as the form names it, never by its path', async () => {
    const { page, farmId } = await ownerPage(harness);
    const scenarios = (await (await page.request.get(`/api/farms/${farmId}/scenarios`)).json()) as { id: number; name: string }[];
    const scenario = scenarios.find((s) => s.name !== 'First look') ?? scenarios[0];
    await page.goto(`/farms/${farmId}/scenarios/${scenario?.id}?section=herd`);
    const cows = page.locator('#field-herd-cows');
    await cows.waitFor();
    await cows.fill('190.5');
    await page.getByRole('button', { name: 'Save', exact: true }).click();
    const message = page.locator('.save-message');
    await until(() => message.isVisible()).toBe(true);
    const text = (await message.textContent()) ?? '';
    // The schema's int rule on herd.cows (shared/schema/herd.ts), worded with HerdForm's label.
    expect(text).toContain('Cows in the herd: must be a whole number');
    expect(text).not.toMatch(/scenario\.|herd\.cows/);
    // Beside the input: its own label, and the figure as typed rather than rounded to a whole cow.
    expect(await page.locator('#field-herd-cows-error').textContent()).toBe('Cows must be a whole number');
    expect(await cows.inputValue()).toBe('190.5');
    await harness.screenshot(page, 'words-plain-error-desktop');
  });

  it('asks for a number style by country and groups thousands in the inputs', async () => {
    const { page, farmId } = await ownerPage(harness);
    await page.goto(`/farms/${farmId}/baseline`);
    const locale = page.locator('#locale');
    await locale.waitFor();
    const styles = await locale.locator('option').allTextContents();
    // CLDR number patterns through Intl (from memory): Ireland 1,234.5; Germany 1.234,5.
    expect(styles).toContain('Ireland — 1,234.5');
    expect(styles).toContain('Germany — 1.234,5');
    for (const style of styles) expect(style).not.toMatch(/^[a-z]{2}-[A-Z]{2}$/);
    expect(await page.locator('#currency option').allTextContents()).toContain('Euro (€)');
    const heifer = page.locator('#field-herd-replacementHeiferCost');
    expect(await heifer.inputValue()).toMatch(/^\d{1,3}(,\d{3})+$|^\d{1,3}$/);
    await locale.selectOption('de-DE');
    // A four-digit cost reads with the German group mark once the style changes.
    await until(() => heifer.inputValue()).toMatch(/^\d{1,3}(\.\d{3})+$/);
    await harness.screenshot(page, 'words-baseline-number-style-desktop');
    const phone = await ownerPage(harness, PHONE);
    await phone.page.goto(`/farms/${farmId}/baseline`);
    await phone.page.locator('#locale').waitFor();
    await harness.screenshot(phone.page, 'words-baseline-number-style-phone');
  });

  it('tags a typed cost as the farm’s and a quoted line as a quote, on screen and in the workbook', async () => {
    const { page, farmId } = await ownerPage(harness);
    const scenarios = (await (await page.request.get(`/api/farms/${farmId}/scenarios`)).json()) as { id: number; name: string }[];
    const scenario = scenarios.find((s) => s.name.includes('mattress or sand')) ?? scenarios[0];
    const doc = (await (await page.request.get(`/api/farms/${farmId}/scenarios/${scenario?.id}`)).json()) as ScenarioDoc;
    const option = doc.scenario.options.find((o) => !o.current);
    const [typedLine, quotedLine] = option?.capitalLines.filter((line) => line.kind === 'item') ?? [];
    expect(typedLine && quotedLine, 'the demo option has two capital items').toBeTruthy();

    await page.goto(`/farms/${farmId}/scenarios/${scenario?.id}?section=capital`);
    const typedRow = page.locator(`tr[data-line-id="${typedLine?.id}"]`);
    await typedRow.waitFor();
    expect(await typedRow.locator('.source-chip').textContent()).toContain('assumption');
    const cost = typedRow.locator('input[data-path$=".unitCost"]');
    await cost.fill('210');
    await until(() => typedRow.locator('.source-chip').textContent()).toContain('your figure');
    await page.getByRole('button', { name: 'Save', exact: true }).click();
    await until(() => page.locator('.unsaved').count()).toBe(0);

    // A quote with an amount on the second line, through the documents API as the panel sends it.
    const upload = await page.request.post(`/api/farms/${farmId}/documents`, {
      headers: { origin: harness.url },
      multipart: { scenarioId: String(scenario?.id), capitalLineId: quotedLine?.id ?? '', file: { name: 'alley quote.pdf', mimeType: 'application/pdf', buffer: pdfBytes(4000) } },
    });
    expect(upload.status()).toBe(201);
    const uploaded = (await upload.json()) as { id: number };
    expect((await page.request.patch(`/api/farms/${farmId}/documents/${uploaded.id}`, { data: { quoteAmount: 44_000 }, headers: { origin: harness.url } })).status()).toBe(200);
    await page.reload();
    const quotedRow = page.locator(`tr[data-line-id="${quotedLine?.id}"]`);
    await until(() => quotedRow.locator('.source-chip').textContent()).toContain('quote');
    await harness.screenshot(page, 'words-source-tags-desktop');

    const workbook = new ExcelJS.Workbook();
    const bytes = await (await page.request.get(`/api/farms/${farmId}/scenarios/${scenario?.id}/workbook.xlsx`)).body();
    // ExcelJS types its load() argument as its own Buffer; the bytes are a Node Buffer.
    await workbook.xlsx.load(bytes as unknown as ExcelJS.Buffer);
    const rows: string[][] = [];
    workbook.getWorksheet('Assumptions')?.eachRow((row) => rows.push((row.values as unknown[]).slice(1).map((v) => String(v ?? ''))));
    const section = rows.findIndex((row) => row[0]?.startsWith(`Option: ${option?.name}`));
    const inOption = rows.slice(section);
    expect(inOption.find((row) => row[0] === `${typedLine?.description}: Cost per unit today`)?.[3]).toMatch(/^Farm figure: Entered by the farm/);
    expect(inOption.find((row) => row[0] === `${quotedLine?.description}: Cost per unit today`)?.[3]).toBe('Quote: €44,000 (alley quote.pdf)');
  });

  it('shows the capital table whole: no cut labels, a lump sum without ×, totals beside their names on a phone', async () => {
    const { page, farmId } = await ownerPage(harness);
    const scenarios = (await (await page.request.get(`/api/farms/${farmId}/scenarios`)).json()) as { id: number; name: string }[];
    const scenario = scenarios.find((s) => s.name.includes('mattress or sand')) ?? scenarios[0];
    await page.goto(`/farms/${farmId}/scenarios/${scenario?.id}?section=capital`);
    await page.locator('tr[data-line-id]').first().waitFor();
    expect(await cutSelectLabels(page, '.capital-table')).toEqual([]);
    const lump = page.locator('[data-lump-sum]').first();
    expect(await lump.textContent()).toBe('one sum');
    expect(await page.locator('.capital-table tbody').textContent()).not.toContain('×');
    const scroll = await page.evaluate(() => {
      const box = document.querySelector('.table-scroll');
      return box ? box.scrollWidth - box.clientWidth : -1;
    });
    expect(scroll, 'the table fits a 1366 px window without scrolling').toBeLessThanOrEqual(1);
    await harness.screenshot(page, 'words-capital-table-desktop');

    const phone = await ownerPage(harness, PHONE);
    await phone.page.goto(`/farms/${farmId}/scenarios/${scenario?.id}?section=capital`);
    const grand = phone.page.locator('.capital-table tfoot .grand');
    await grand.waitFor();
    const [label, value] = await Promise.all([grand.locator('th').boundingBox(), grand.locator('td.num').boundingBox()]);
    // Beside each other on one line, both inside the 390 px window.
    expect(label && value && Math.abs(label.y - value.y) < 8).toBe(true);
    expect((value?.x ?? 999) + (value?.width ?? 0)).toBeLessThanOrEqual(PHONE.width);
    expect(await cutSelectLabels(phone.page, '.capital-table')).toEqual([]);
    await harness.screenshot(phone.page, 'words-capital-table-phone');
  });

  it('names the option with each capital line in the document picker', async () => {
    const { page, farmId } = await ownerPage(harness);
    const scenarios = (await (await page.request.get(`/api/farms/${farmId}/scenarios`)).json()) as { id: number; name: string }[];
    const scenario = scenarios.find((s) => s.name.includes('mattress or sand')) ?? scenarios[0];
    const doc = (await (await page.request.get(`/api/farms/${farmId}/scenarios/${scenario?.id}`)).json()) as ScenarioDoc;
    await page.goto(`/farms/${farmId}/documents?scenarioId=${scenario?.id}`);
    await page.locator('#doc-line').click();
    const choices = await page.getByRole('option').allTextContents();
    for (const option of doc.scenario.options) {
      const line = option.capitalLines[0];
      if (line) expect(choices).toContain(`${line.description} — ${option.name}`);
    }
    await harness.screenshot(page, 'words-document-line-picker-desktop');
  });
});
