/**
 * What a lender reads of a share, in Chromium: the share promises "results, comparison, risk and
 * the workbook" (docs/product.md, Lender package; docs/design.md, Flow 5: "the same scenario
 * read-only"), so the lender view shows the Monte Carlo run the farm kept, the sensitivity,
 * coverage year by year with the below-threshold flag, the capital lines with their quotes and
 * documents, and the print view. Also: the lender lands on the newest share after sign-in, a
 * baseline address gets a refusal rather than an empty form, and the pages fit a 390 px phone.
 * Screenshots at 1366 px and 390 px land in tests/.artifacts/screenshots/.
 */
import { readFileSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runMonteCarlo, type MonteCarloResult } from '../../shared/engine/risk/monte-carlo.js';
import { scenarioSchema, type Scenario } from '../../shared/schema/index.js';
import { utcDatePlusDays } from '../../shared/schema/lender.js';
import type { OptionResult } from '../../shared/engine/results.js';
import { signInThroughForm, startBrowserHarness, type BrowserHarness } from '../helpers/browser.js';
import { pdfBytes } from '../helpers/uploads.js';

const DESKTOP = { width: 1366, height: 900 };
const PHONE = { width: 390, height: 844 };
const QUOTE_AMOUNT = 96_400;
const poll = <T>(fn: () => T | Promise<T>) => expect.poll(fn, { timeout: 20_000, interval: 100 });

/** Whole currency units read back from a formatted cell ("−€12,345" → −12345); U+2212 is the app's minus. */
const amount = (text: string): number => Number(text.replace(/[−–]/g, '-').replace(/[^\d.-]/g, ''));

function widest(page: Page): Promise<string> {
  return page.evaluate(() =>
    [...document.querySelectorAll('body *')]
      .filter((element) => element.getBoundingClientRect().right > window.innerWidth + 1)
      .slice(0, 6)
      .map((element) => `${element.tagName}.${[...element.classList].join('.')}`)
      .join(', '),
  );
}

async function fitsPhone(page: Page, what: string): Promise<void> {
  await expect
    .poll(() => page.evaluate(() => document.documentElement.scrollWidth), { message: `${what} is wider than the phone: ${await widest(page)}`, timeout: 5000 })
    .toBeLessThanOrEqual(PHONE.width);
}

describe('the lender sees what the share promises', () => {
  let harness: BrowserHarness;
  let farmId: number;
  let scenarioId: number;
  let scenario: Scenario;
  let results: { options: OptionResult[] };
  let kept: MonteCarloResult;
  let quotedLine: { optionId: string; lineId: string; description: string };

  beforeAll(async () => {
    harness = await startBrowserHarness();
    // The owner keeps a Monte Carlo run on the shared version and puts a quote on one capital line.
    const context = await harness.newContext(DESKTOP);
    const page = await context.newPage();
    await signInThroughForm(page, 'owner@byrecast.test');
    const [farms] = (await harness.database.pool.query('SELECT id FROM farms WHERE name = ?', ['Cairnbrook Farm'])) as unknown as [{ id: number }[]];
    farmId = farms[0]!.id;
    const [shares] = (await harness.database.pool.query('SELECT scenario_id AS id FROM lender_shares WHERE farm_id = ?', [farmId])) as unknown as [{ id: number }[]];
    scenarioId = shares[0]!.id;
    const view = (await (await page.request.get(`/api/farms/${farmId}/scenarios/${scenarioId}`)).json()) as { scenario: Scenario; version: number; results: { options: OptionResult[] } };
    scenario = scenarioSchema.parse(view.scenario);
    results = view.results;
    // Fewer draws than the scenario's own keep the test quick; the run is still the shared core's.
    kept = runMonteCarlo(scenario, { ...scenario.risk.monteCarlo, draws: 400 });
    const put = await page.request.put(`/api/farms/${farmId}/scenarios/${scenarioId}/risk-result`, { data: { scenarioVersion: view.version, result: kept } });
    expect(put.status()).toBe(200);

    const candidate = scenario.options.find((o) => !o.current && o.capitalLines.some((l) => l.kind === 'item'))!;
    const line = candidate.capitalLines.find((l) => l.kind === 'item')!;
    quotedLine = { optionId: candidate.id, lineId: line.id, description: line.description };
    const upload = await page.request.post(`/api/farms/${farmId}/documents`, {
      multipart: { scenarioId: String(scenarioId), capitalLineId: line.id, file: { name: 'Shell contractor quote.pdf', mimeType: 'application/pdf', buffer: pdfBytes() } },
    });
    expect(upload.status()).toBe(201);
    const documentId = ((await upload.json()) as { id: number }).id;
    expect((await page.request.patch(`/api/farms/${farmId}/documents/${documentId}`, { data: { quoteAmount: QUOTE_AMOUNT } })).status()).toBe(200);
    await context.close();
  }, 120_000);
  afterAll(async () => {
    await harness?.close();
  });

  it('shows the kept risk run, coverage by year, the quoted capital lines and the print view', async () => {
    const context = await harness.newContext(DESKTOP);
    const page = await context.newPage();
    // After sign-in the lender lands on their newest share, not on a list.
    await signInThroughForm(page, 'lender@byrecast.test');
    await page.waitForURL(new RegExp(`/farms/${farmId}/shared/${scenarioId}$`));
    await poll(() => page.getByRole('heading', { name: 'Risk: what could happen' }).count()).toBe(1);
    await expect.poll(() => page.getByRole('navigation', { name: 'Breadcrumb' }).innerText()).toContain(scenario.name);

    // Risk: the kept run, per candidate, in the family's words, to the whole unit of the engine's figures.
    const risk = page.getByTestId('shared-risk');
    for (const option of kept.options.filter((o) => !o.current && o.incrementalNpv)) {
      const row = risk.locator(`tr[data-outcome="${option.optionId}"]`);
      expect(amount(await row.locator('[data-figure="bad"]').innerText())).toBe(Math.round(option.incrementalNpv!.p10!));
      expect(amount(await row.locator('[data-figure="middle"]').innerText())).toBe(Math.round(option.incrementalNpv!.p50!));
      expect(amount(await row.locator('[data-figure="good"]').innerText())).toBe(Math.round(option.incrementalNpv!.p90!));
      expect(amount(await row.locator('[data-figure="loss"]').innerText())).toBe(Math.round(option.incrementalNpv!.probabilityNegative! * 100));
    }
    // The comparison carries the same chance beside the change's other figures, to a tenth of a percent.
    const chanceRow = page.locator('tr[data-risk-row="chance-of-loss"]');
    for (const option of kept.options.filter((o) => !o.current && o.incrementalNpv)) {
      const cell = chanceRow.locator(`td[data-option-id="${option.optionId}"]`);
      expect(amount(await cell.innerText())).toBeCloseTo(option.incrementalNpv!.probabilityNegative! * 100, 1);
    }
    expect(await risk.getByText('1-in-10 bad').count()).toBeGreaterThan(0);
    // The statistics' names sit under the closed "advanced" fold.
    expect(await risk.getByText('P10 of the change').isVisible()).toBe(false);
    await risk.getByText('Advanced: the statistics behind these figures').click();
    expect(await risk.getByText('P10 of the change').isVisible()).toBe(true);
    // The sensitivity of the shared version, read-only (no range inputs).
    await risk.getByTestId('sensitivity-table').waitFor();
    expect(await risk.getByTestId('sensitivity-table').locator('input').count()).toBe(0);
    // Each driver once: the lying-time milk is the response × the hours gained, one row (docs/model.md, Risk).
    const drivers = await risk.getByTestId('sensitivity-table').locator('tbody th[scope="row"]').allInnerTexts();
    expect(new Set(drivers).size).toBe(drivers.length);
    expect(drivers).toContain('Milk response to lying time');
    expect(drivers).not.toContain('Lying-time gain');

    // Coverage by year: pick an option with a year under the lender's threshold when there is one.
    const threshold = scenario.finance.coverageThreshold;
    const tight = results.options.find((o) => o.yearsBelowCoverageThreshold.length > 0) ?? results.options.find((o) => !o.current)!;
    await page.locator('section[aria-labelledby="option-title"] .p-select').click();
    await page.getByRole('option', { name: tight.current ? `${tight.name} (current)` : tight.name, exact: true }).click();
    const coverage = page.getByTestId('coverage-years');
    await poll(() => page.locator('#coverage-years-title').innerText()).toContain(tight.name);
    const cells = await coverage.locator('td[data-measure]').evaluateAll((tds) =>
      tds.map((td) => ({ value: (td as HTMLElement).dataset.value ?? '', flagged: td.querySelector('.negative') !== null })),
    );
    const years = tight.coverage.filter((c) => c.year > 0 && (c.wholeFarm !== null || c.project !== null));
    expect(await coverage.locator('tbody tr').count()).toBe(years.length);
    let flagged = 0;
    for (const cell of cells) {
      if (cell.value === '') continue;
      // The same mark as the comparison's coverage cells (tests/browser/screens.test.ts): below the threshold, and only then.
      expect(cell.flagged, `${cell.value} against ${threshold}`).toBe(Number(cell.value) < threshold);
      if (cell.flagged) flagged += 1;
    }
    const wholeFarmBelow = tight.coverage.filter((c) => c.year > 0 && c.wholeFarm !== null && c.wholeFarm < threshold).length;
    expect(flagged).toBeGreaterThanOrEqual(wholeFarmBelow);
    expect(wholeFarmBelow).toBe(tight.yearsBelowCoverageThreshold.length);
    await harness.screenshot(page, 'lender-view-risk-coverage-desktop');

    // Capital: the quoted line shows its quote and its document; the others read as estimates.
    const quotedOption = results.options.find((o) => o.id === quotedLine.optionId)!;
    await page.locator('section[aria-labelledby="option-title"] .p-select').click();
    await page.getByRole('option', { name: quotedOption.name, exact: true }).click();
    const capital = page.getByTestId('shared-capital');
    const line = capital.locator(`tr[data-line="${quotedLine.lineId}"]`);
    await poll(() => line.locator('[data-backing="quote"]').count()).toBe(1);
    expect(amount(await line.locator('[data-backing="quote"]').innerText())).toBe(QUOTE_AMOUNT);
    expect(await capital.locator('[data-backing="estimate"]').count()).toBeGreaterThan(0);
    // A quote below the line's cost is said in words; the summary names the quoted sum, never the line's cost as "backed".
    const lineCost = amount(await line.locator('td.num').innerText());
    expect(await line.locator('[data-quote-gap]').innerText()).toContain(lineCost > QUOTE_AMOUNT ? 'below' : 'above');
    expect(amount((await page.getByTestId('capital-backing').innerText()).split('(')[1]!.split(')')[0]!)).toBe(QUOTE_AMOUNT);
    const link = line.locator('a[data-document]');
    expect(await link.innerText()).toBe('Shell contractor quote.pdf');
    const download = await page.request.get((await link.getAttribute('href'))!);
    expect(download.status()).toBe(200);
    // A PDF starts with "%PDF-" (ISO 32000-1, 7.5.2 "File header").
    expect((await download.body()).subarray(0, 5).toString('latin1')).toBe('%PDF-');
    // The table's total is the engine's capital for the option, to the whole unit.
    expect(amount(await capital.locator('tfoot td.num').innerText())).toBe(Math.round(quotedOption.capitalTotal));
    await page.evaluate(() => document.querySelector('[data-testid="shared-capital"]')?.scrollIntoView());
    await harness.screenshot(page, 'lender-view-capital-desktop');

    // The change in two parts, as on the results screen, when an option changes the herd: the
    // housing with today's herd and the expansion, to the whole unit of the engine's NPVs; and the
    // option's stress test beside its coverage (docs/model.md "Housing and expansion", "Stress").
    const split = quotedOption.incremental?.split ?? null;
    const splitTable = page.getByTestId('expansion-split');
    await poll(() => page.getByTestId('stress-table').count()).toBe(1);
    expect(await splitTable.count()).toBe(split ? 1 : 0);
    if (split) {
      expect(amount(await splitTable.getByTestId('split-housing').locator('td.num').first().innerText())).toBe(Math.round(split.housingTodaysHerd.npv));
      expect(amount(await splitTable.getByTestId('split-expansion').locator('td.num').first().innerText())).toBe(Math.round(split.expansion.npv));
    }

    // The phone reads the same page without sideways scrolling.
    await page.setViewportSize(PHONE);
    await fitsPhone(page, 'the lender view');
    // The lender reads the figures first; the review follows them, a link away (docs/design.md, Flow).
    const summaryTop = await page.locator('.card.summary').evaluate((el) => el.getBoundingClientRect().top);
    const reviewTop = await page.locator('#your-review').evaluate((el) => el.getBoundingClientRect().top);
    const compareTop = await page.getByTestId('shared-risk').evaluate((el) => el.getBoundingClientRect().top);
    expect(summaryTop).toBeLessThan(reviewTop);
    expect(compareTop).toBeLessThan(reviewTop);
    expect(await page.locator('a[data-action="to-review"]').isVisible()).toBe(true);
    await harness.screenshot(page, 'lender-view-phone');
    await page.setViewportSize(DESKTOP);
    expect(await page.locator('a[data-action="to-review"]').isVisible()).toBe(false);

    // The print view, a click away, carries the kept run too.
    await page.setViewportSize(DESKTOP);
    await page.locator('a[data-action="print"]').click();
    await page.waitForURL(new RegExp(`/farms/${farmId}/scenarios/${scenarioId}/print$`));
    const printRisk = page.getByTestId('print-risk');
    await poll(() => printRisk.locator('tbody tr').count()).toBe(kept.options.filter((o) => !o.current && o.incrementalNpv).length);
    // The family page reads the kept run; the split shows one table per option whose change splits.
    await poll(() => page.getByTestId('family-summary').locator('[data-figure="risk"]').count()).toBe(kept.options.filter((o) => !o.current && o.incrementalNpv).length);
    expect(await page.locator('[data-testid="print-split"] [data-testid="expansion-split"]').count()).toBe(results.options.filter((o) => o.incremental?.split).length);
    await harness.screenshot(page, 'lender-print-desktop');
    await page.setViewportSize(PHONE);
    await fitsPhone(page, 'the print view');
    await harness.screenshot(page, 'lender-print-phone');
    expect(await page.getByRole('link', { name: /Back to what is shared/ }).count()).toBe(1);
    await context.close();
  }, 180_000);

  it('refuses the lender the farm baseline with a clear page, not an empty form', async () => {
    const context = await harness.newContext(DESKTOP);
    const page = await context.newPage();
    await signInThroughForm(page, 'lender@byrecast.test');
    await page.goto(`/farms/${farmId}/baseline`);
    await poll(() => page.getByTestId('baseline-refused').count()).toBe(1);
    // docs/product.md (role table): read-only on the scenarios shared with them, and nothing else.
    expect(await page.locator('main form').count()).toBe(0);
    expect(await page.locator('main input').count()).toBe(0);
    expect(await page.getByRole('button', { name: /Save/ }).count()).toBe(0);
    await harness.screenshot(page, 'lender-baseline-refused-desktop');
    await page.getByRole('link', { name: 'Open what is shared with you' }).click();
    await page.waitForURL(new RegExp(`/farms/${farmId}/shared/\\d+$`));
    await page.setViewportSize(PHONE);
    await page.goto(`/farms/${farmId}/baseline`);
    await poll(() => page.getByTestId('baseline-refused').count()).toBe(1);
    await fitsPhone(page, 'the refusal');
    await harness.screenshot(page, 'lender-baseline-refused-phone');

    // The milk records are the farm's own data too: the same refusal, no import, no permission error.
    for (const viewport of [DESKTOP, PHONE]) {
      await page.setViewportSize(viewport);
      await page.goto(`/farms/${farmId}/milk-records/import`);
      await poll(() => page.getByTestId('milk-import-refused').count()).toBe(1);
      expect(await page.locator('main input').count()).toBe(0);
      expect(await page.locator('main .p-message-error').count()).toBe(0);
      expect(await page.getByRole('link', { name: 'Open what is shared with you' }).count()).toBe(1);
      if (viewport === PHONE) await fitsPhone(page, 'the milk-record refusal');
      await harness.screenshot(page, `lender-milk-import-refused-${viewport === PHONE ? 'phone' : 'desktop'}`);
    }
    await context.close();
  });

  it('lands the farmer with exactly one farm on that farm after sign-in', async () => {
    const context = await harness.newContext(DESKTOP);
    const page = await context.newPage();
    const [rows] = (await harness.database.pool.query(
      "SELECT COUNT(*) AS n FROM memberships m JOIN users u ON u.id = m.user_id WHERE u.email = 'owner@byrecast.test'",
    )) as unknown as [{ n: number }[]];
    expect(Number(rows[0]!.n)).toBe(1);
    await signInThroughForm(page, 'owner@byrecast.test');
    await page.waitForURL(new RegExp(`/farms/${farmId}$`));
    await context.close();
  });
  it('lands the lender on the newest of their shares, and names the scenario in the version history breadcrumb', async () => {
    // The owner shares a second scenario with the demo lender, who accepts it while signed in.
    const ownerContext = await harness.newContext(DESKTOP);
    const owner = await ownerContext.newPage();
    await signInThroughForm(owner, 'owner@byrecast.test');
    const list = (await (await owner.request.get(`/api/farms/${farmId}/scenarios`)).json()) as { id: number; name: string }[];
    const second = list.find((s) => s.id !== scenarioId)!;
    const shared = await owner.request.post(`/api/farms/${farmId}/scenarios/${second.id}/lender-shares`, { data: { email: 'lender@byrecast.test', expiresOn: utcDatePlusDays(new Date(), 30) } });
    expect(shared.status()).toBe(201);
    // The version history names the scenario in the one breadcrumb style.
    await owner.goto(`/farms/${farmId}/scenarios/${second.id}/versions`);
    await poll(() => owner.getByRole('navigation', { name: 'Breadcrumb' }).innerText()).toContain(second.name);
    await harness.screenshot(owner, 'version-history-breadcrumb-desktop');
    await ownerContext.close();

    const outbox = (await (await harness.newContext(DESKTOP)).request.get(`${harness.url}/api/dev/outbox`)).json() as Promise<{ messages: { to: string; links: string[] }[] }>;
    const link = (await outbox).messages.find((m) => m.to === 'lender@byrecast.test')?.links.find((l) => l.includes('/lender-shares/'));
    expect(link).toBeDefined();
    const token = decodeURIComponent(link!.split('/lender-shares/')[1]!);
    const lenderContext = await harness.newContext(DESKTOP);
    const lender = await lenderContext.newPage();
    await signInThroughForm(lender, 'lender@byrecast.test');
    expect((await lender.request.post(`/api/lender-shares/${encodeURIComponent(token)}/accept`, { data: {} })).status()).toBe(200);
    await lenderContext.close();

    const again = await (await harness.newContext(DESKTOP)).newPage();
    await signInThroughForm(again, 'lender@byrecast.test');
    await again.waitForURL(new RegExp(`/farms/${farmId}/shared/${second.id}$`));
    await poll(() => again.getByRole('navigation', { name: 'Breadcrumb' }).innerText()).toContain(second.name);
  }, 120_000);
});

const FIVE_SYSTEMS = 'scenarios/cairnbrook-five-systems.json';

/** The workspace address of the demo five-systems scenario. */
async function demoBase(page: Page): Promise<string> {
  const farms = (await (await page.request.get('/api/farms')).json()) as { id: number }[];
  const file = JSON.parse(readFileSync(FIVE_SYSTEMS, 'utf8')) as { name: string };
  const list = (await (await page.request.get(`/api/farms/${farms[0]!.id}/scenarios`)).json()) as { id: number; name: string }[];
  return `/farms/${farms[0]!.id}/scenarios/${list.find((s) => s.name === file.name)!.id}`;
}

describe('risk in everyday words, toasts clear of the button, charts readable in dark mode', () => {
  let harness: BrowserHarness;
  let base = '';

  beforeAll(async () => {
    harness = await startBrowserHarness();
  });
  afterAll(async () => {
    await harness?.close();
  });

  it('says "not run yet", names the runs, explains the interest rate, folds the statistics and fits a phone', async () => {
    const context = await harness.newContext(DESKTOP);
    const page = await context.newPage();
    await signInThroughForm(page, 'owner@byrecast.test');
    base = await demoBase(page);
    const scenario = scenarioSchema.parse(JSON.parse(readFileSync(FIVE_SYSTEMS, 'utf8')));
    await page.goto(`${base}/risk`);
    await page.getByTestId('sensitivity-table').waitFor();

    // Nothing kept yet on a fresh demo farm: the screen says so and what to do.
    await poll(() => page.getByTestId('mc-not-run').innerText()).toContain('Not run yet');
    const draws = scenario.risk.monteCarlo.draws;
    await poll(() => page.locator('#mc-title').innerText()).toBe(`What could happen in ${new Intl.NumberFormat('en-IE').format(draws)} runs`);
    // Seed, standard deviation and correlation ρ are under the closed "advanced" fold.
    expect(await page.locator('#mc-seed').isVisible()).toBe(false);
    expect(await page.locator('#mc-rho').isVisible()).toBe(false);

    // The interest rate moves the loan, not the NPV: the screen says why in words.
    if (scenario.risk.sensitivity.interestRate.low !== 0 || scenario.risk.sensitivity.interestRate.high !== 0) {
      await poll(() => page.getByTestId('financing-why').first().innerText()).toMatch(/^Why the interest rate moves the NPV by .*the loan payments and the coverage the bank reads/s);
    }
    await harness.screenshot(page, 'risk-words-desktop');

    // A short run: the result table speaks of bad, middle and good runs.
    await page.getByTestId('mc-settings-advanced').locator('summary').click();
    await page.locator('#mc-draws').fill('500');
    await page.locator('#mc-draws').blur();
    await page.getByTestId('mc-run').click();
    await poll(() => page.getByTestId('mc-summary').count()).toBe(1);
    const header = await page.getByTestId('mc-summary').locator('thead').innerText();
    expect(header).toContain('1-in-10 bad');
    expect(header).toContain('Middle');
    expect(header).toContain('1-in-10 good');
    expect(header).not.toContain('P10');
    expect(await page.getByTestId('mc-not-run').count()).toBe(0);
    await harness.screenshot(page, 'risk-words-run-desktop');

    // On a phone the sensitivity table fits: every input is a card, no sideways scrolling.
    await page.setViewportSize(PHONE);
    await page.reload();
    await page.getByTestId('sensitivity-table').waitFor();
    await fitsPhone(page, 'the risk screen');
    const table = await page.getByTestId('sensitivity-table').evaluate((t) => ({ scroll: t.scrollWidth, client: t.parentElement?.clientWidth ?? 0 }));
    expect(table.scroll).toBeLessThanOrEqual(PHONE.width);
    expect(table.scroll).toBeLessThanOrEqual(table.client);
    await harness.screenshot(page, 'risk-words-phone');
    await context.close();
  }, 180_000);

  it('shows each toast away from the button just pressed, at the bottom of the page and at the top', async () => {
    const context = await harness.newContext(DESKTOP);
    const page = await context.newPage();
    await signInThroughForm(page, 'owner@byrecast.test');
    if (!base) base = await demoBase(page);
    const farm = base.replace(/\/scenarios\/\d+$/, '');
    const toastClear = async (button: ReturnType<Page['getByRole']>, what: string) => {
      const pressed = (await button.boundingBox())!;
      await button.click();
      const toast = page.locator('.p-toast-message').first();
      await toast.waitFor();
      const box = (await toast.boundingBox())!;
      const overlap = box.x < pressed.x + pressed.width && pressed.x < box.x + box.width && box.y < pressed.y + pressed.height && pressed.y < box.y + box.height;
      expect(overlap, `${what}: toast ${JSON.stringify(box)} over the button ${JSON.stringify(pressed)}`).toBe(false);
      await harness.screenshot(page, `toast-${what}`);
      await toast.locator('.p-toast-close-button').click();
      await toast.waitFor({ state: 'detached' });
    };
    // The baseline's save bar sticks to the bottom right, where toasts used to appear.
    await page.goto(`${farm}/baseline`);
    await toastClear(page.getByRole('button', { name: 'Save herd and markets' }), 'baseline-save');
    // A scenario row's Duplicate near the top of the farm page.
    await page.goto(farm);
    await toastClear(page.getByRole('button', { name: /^Duplicate New barn: mattress or sand$/ }), 'farm-duplicate');
    await context.close();
  });

  it('draws chart labels in the dark theme’s text colour, readable against the card', async () => {
    const context = await harness.newContext(DESKTOP);
    await context.addInitScript(() => localStorage.setItem('byrecast-theme', 'dark'));
    const page = await context.newPage();
    await signInThroughForm(page, 'owner@byrecast.test');
    if (!base) base = await demoBase(page);
    await page.goto(`${base}/compare`);
    await page.locator('.apexcharts-canvas').first().waitFor();
    await page.waitForTimeout(300);
    const read = await page.evaluate(() => {
      const label = document.querySelector('.apexcharts-xaxis-label, .apexcharts-yaxis-label');
      // The colour behind the chart: the nearest ancestor with a background of its own.
      let element: Element | null = label;
      let background = '';
      while (element) {
        const colour = getComputedStyle(element).backgroundColor;
        if (colour && colour !== 'transparent' && !/rgba\(.*,\s*0\)$/.test(colour)) {
          background = colour;
          break;
        }
        element = element.parentElement;
      }
      return {
        fill: label?.getAttribute('fill') ?? '',
        text: getComputedStyle(document.documentElement).getPropertyValue('--by-text').trim(),
        background,
      };
    });
    expect(read.fill.toLowerCase()).toBe(read.text.toLowerCase());
    expect(read.background).not.toBe('');
    // WCAG 2.1 SC 1.4.3: text contrast at least 4.5:1 (relative luminance as WCAG 2.1 defines it).
    const channels = (css: string): number[] => {
      const hex = css.startsWith('#') ? css.slice(1) : '';
      if (hex.length === 6) return [0, 2, 4].map((i) => parseInt(hex.slice(i, i + 2), 16));
      return (css.match(/\d+(\.\d+)?/g) ?? []).slice(0, 3).map(Number);
    };
    const luminance = (css: string): number => {
      const [r, g, b] = channels(css).map((v) => {
        const c = v / 255;
        return c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
      });
      return 0.2126 * r! + 0.7152 * g! + 0.0722 * b!;
    };
    const [light, dark] = [luminance(read.fill), luminance(read.background)].sort((a, b) => b - a);
    expect((light! + 0.05) / (dark! + 0.05)).toBeGreaterThanOrEqual(4.5);
    await harness.screenshot(page, 'compare-dark-desktop');
    await page.setViewportSize(PHONE);
    await harness.screenshot(page, 'compare-dark-phone');
    await context.close();
  });
});
