/**
 * The server the HTTP benchmark loads, in its own process (so the load generator does not share
 * its thread): the real app on BENCH_DATABASE_URL with the demo seeded, on a free loopback port.
 * Prints `listening <url>` when ready; stops on SIGTERM.
 */
import { randomBytes } from 'node:crypto';
import { loadConfig } from '../../server/config.js';
import { startServer } from '../../server/serve.js';

const databaseUrl = process.env.BENCH_DATABASE_URL;
if (!databaseUrl) throw new Error('BENCH_DATABASE_URL is not set');
const config = loadConfig({ NODE_ENV: 'production', PORT: '0', LOG_LEVEL: 'silent', BCRYPT_COST: '4', DIST_DIR: '/nonexistent', JWT_SECRET: randomBytes(32).toString('hex') });
const running = await startServer({ databaseUrl, config, seedDemo: true });
process.stdout.write(`listening ${running.url}\n`);
process.on('SIGTERM', () => {
  void running.close().finally(() => process.exit(0));
});
