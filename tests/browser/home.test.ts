import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserHarness, type BrowserHarness } from '../helpers/browser.js';

describe('home page in Chromium', () => {
  let harness: BrowserHarness;
  beforeAll(async () => {
    harness = await startBrowserHarness();
  });
  afterAll(async () => {
    await harness?.close();
  });

  it('shows the product with our font and theme, not a framework default', async () => {
    const context = await harness.newContext();
    const page = await context.newPage();
    await page.goto('/');
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toContain('new barn');

    await page.evaluate(() => document.fonts.ready);
    const look = await page.evaluate(() => {
      const bar = document.querySelector('.top-bar');
      const button = document.querySelector('.actions .p-button');
      return {
        font: getComputedStyle(document.body).fontFamily,
        fontLoaded: document.fonts.check('700 16px "Merriweather Sans"'),
        barBackground: bar ? getComputedStyle(bar).backgroundColor : '',
        primaryButton: button ? getComputedStyle(button).backgroundColor : '',
      };
    });
    expect(look.font).toContain('Merriweather Sans');
    expect(look.fontLoaded).toBe(true);
    expect(look.barBackground).toBe('rgb(38, 50, 58)'); // slate #26323a
    expect(look.primaryButton).toBe('rgb(63, 111, 90)'); // byre green #3f6f5a
    await harness.screenshot(page, 'home-desktop');
  });

  it('serves client routes through the history fallback and shows a not-found page', async () => {
    const context = await harness.newContext({ width: 820, height: 1180 });
    const page = await context.newPage();
    const response = await page.goto('/no/such/page');
    expect(response?.status()).toBe(200);
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('Nothing here');
    await harness.screenshot(page, 'not-found-tablet');
  });
});
