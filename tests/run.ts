/**
 * `npm test`: starts a throwaway MariaDB on a free loopback port with a fresh data directory,
 * builds the client once, runs every vitest project (unit, API, browser), then stops the
 * server and removes its data, whatever the outcome. Arguments go to vitest.
 * First it checks the Debian programs the tests use and installs the missing ones (as root) or
 * stops with the apt-get line to run: no test is skipped for a missing tool.
 */
import { spawn, spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { startLocalMariadb } from '../server/db/local-server.js';
import { CHROMIUM, ensureSystemPackages, LIBREOFFICE_CALC, MARIADB, MissingSystemPackagesError, POPPLER } from '../server/system-packages.js';

try {
  // CHROMIUM_PATH points the browser tests at another Chromium build (tests/helpers/browser.ts).
  const browser = process.env.CHROMIUM_PATH ? [] : [CHROMIUM];
  ensureSystemPackages([MARIADB, ...browser, LIBREOFFICE_CALC, POPPLER], { purpose: 'npm test' });
} catch (error) {
  console.error(error instanceof MissingSystemPackagesError ? error.message : error);
  process.exit(1);
}

const workDir = mkdtempSync(join(tmpdir(), 'byrecast-test-'));
let stopDatabase: (() => Promise<void>) | null = null;

async function cleanUp(): Promise<void> {
  await stopDatabase?.();
  rmSync(workDir, { recursive: true, force: true });
}

for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.on(signal, () => {
    void cleanUp().finally(() => process.exit(130));
  });
}

let exitCode = 1;
try {
  const database = await startLocalMariadb({ dataDir: join(workDir, 'mariadb'), quiet: true });
  stopDatabase = database.stop;
  console.log(`test MariaDB on 127.0.0.1:${database.port}`);

  const distDir = join(workDir, 'dist');
  const build = spawnSync('npx', ['vite', 'build', '--logLevel', 'error', '--outDir', distDir], { stdio: 'inherit' });
  if (build.status !== 0) throw new Error('client build failed');

  exitCode = await new Promise<number>((resolve) => {
    const vitest = spawn('npx', ['vitest', 'run', ...process.argv.slice(2)], {
      stdio: 'inherit',
      env: { ...process.env, TEST_DATABASE_URL: database.serverUrl, BYRECAST_DIST: distDir },
    });
    vitest.on('exit', (code) => resolve(code ?? 1));
  });
} catch (error) {
  console.error(error);
  exitCode = 1;
} finally {
  await cleanUp();
}
process.exit(exitCode);
