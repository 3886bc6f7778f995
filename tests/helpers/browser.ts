/**
 * Real-browser harness: the built client (BYRECAST_DIST, built by tests/run.ts) served by the
 * real server on a free port against a fresh test database with the demo farm, driven through
 * Debian's Chromium with playwright-core (no browser download).
 */
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { findFreePort } from '../../server/db/local-server.js';
import { startServer, type RunningServer } from '../../server/serve.js';
import { testConfig } from './app.js';
import { createTestDatabase, type TestDatabase } from './database.js';

export const SCREENSHOT_DIR = join(process.cwd(), 'tests', '.artifacts', 'screenshots');
export const DEMO_PASSWORD = 'byrecast-demo';

const CHROMIUM_ARGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

export interface BrowserHarness {
  url: string;
  server: RunningServer;
  database: TestDatabase;
  /** A new, isolated browser profile (a second person at another computer). */
  newContext(viewport?: { width: number; height: number }): Promise<BrowserContext>;
  screenshot(page: Page, name: string): Promise<string>;
  close(): Promise<void>;
}

export async function startBrowserHarness(): Promise<BrowserHarness> {
  const distDir = process.env.BYRECAST_DIST;
  if (!distDir) throw new Error('BYRECAST_DIST is not set: run the tests with `npm test`');
  const database = await createTestDatabase();
  const port = await findFreePort();
  const config = testConfig({ port, distDir, appOrigin: `http://127.0.0.1:${port}` });
  const server = await startServer({ databaseUrl: database.url, config, seedDemo: true });
  const contexts: { context: BrowserContext; dir: string }[] = [];
  mkdirSync(SCREENSHOT_DIR, { recursive: true });

  return {
    url: server.url,
    server,
    database,
    async newContext(viewport = { width: 1366, height: 900 }) {
      const dir = mkdtempSync(join(tmpdir(), 'byrecast-chromium-'));
      const context = await chromium.launchPersistentContext(dir, {
        executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
        headless: true,
        args: CHROMIUM_ARGS,
        viewport,
        baseURL: server.url,
        acceptDownloads: true,
      });
      contexts.push({ context, dir });
      return context;
    },
    async screenshot(page, name) {
      const path = join(SCREENSHOT_DIR, `${name}.png`);
      await page.screenshot({ path, fullPage: true });
      return path;
    },
    async close() {
      for (const { context, dir } of contexts) {
        await context.close().catch(() => undefined);
        rmSync(dir, { recursive: true, force: true });
      }
      await server.close();
      await database.drop();
    },
  };
}

/** Signs in through the real form. */
export async function signInThroughForm(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.locator('#password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
}
