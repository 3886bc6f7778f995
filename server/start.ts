/**
 * `npm start`: builds the client when needed, starts the private MariaDB (or uses DATABASE_URL),
 * migrates, loads the demo farm into an empty database and serves everything on one port.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { loadConfig } from './config.js';
import { resolveDatabase, stopOnSignals } from './database-url.js';
import { startServer } from './serve.js';

function newestMtime(dir: string): number {
  let newest = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const path = join(dir, entry.name);
    newest = Math.max(newest, entry.isDirectory() ? newestMtime(path) : statSync(path).mtimeMs);
  }
  return newest;
}

function buildIfNeeded(distDir: string): void {
  const index = join(distDir, 'index.html');
  const sources = Math.max(newestMtime('src'), newestMtime('shared'), statSync('index.html').mtimeMs);
  if (existsSync(index) && statSync(index).mtimeMs >= sources) return;
  console.log('Building the client …');
  const result = spawnSync('npx', ['vite', 'build', '--logLevel', 'warn', '--outDir', distDir], { stdio: 'inherit' });
  if (result.status !== 0) throw new Error('Client build failed');
}

const config = loadConfig({ NODE_ENV: 'production', ...process.env });
buildIfNeeded(config.distDir);
const database = await resolveDatabase(config.dataDir);
let running: Awaited<ReturnType<typeof startServer>> | null = null;
stopOnSignals(async () => {
  await running?.close();
  await database.stop();
});
running = await startServer({ databaseUrl: database.url, config, seedDemo: true });

console.log(`\nByrecast is running at ${running.url}`);
if (running.seed) {
  console.log(running.seed.seeded ? 'Demo farm loaded.' : 'Existing data kept (demo not reloaded).');
  console.log(`Demo sign-ins (password "${running.seed.password}", for local use only):`);
  for (const a of running.seed.accounts) console.log(`  ${a.role ?? 'administrator'}: ${a.email}`);
}
if (!config.smtpUrl) console.log(`E-mail is not sent (no SMTP_URL): invitations and reset links land in ${running.url}/dev/outbox`);
console.log('Press Ctrl-C to stop (MariaDB stops with it).');
