/**
 * `npm run dev`: the private MariaDB stays up while the API restarts on every change (tsx watch)
 * and Vite serves the client with hot reload, proxying /api.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { loadConfig } from './config.js';
import { resolveDatabase, stopOnSignals } from './database-url.js';

const config = loadConfig();
const database = await resolveDatabase(config.dataDir);
const apiPort = process.env.API_PORT ?? '3001';
const env = {
  ...process.env,
  DATABASE_URL: database.url,
  PORT: apiPort,
  APP_ORIGIN: 'http://127.0.0.1:5173',
  JWT_SECRET: process.env.JWT_SECRET ?? 'dev-only-secret-dev-only-secret-0123456789',
};
const children: ChildProcess[] = [
  spawn('npx', ['tsx', 'watch', '--clear-screen=false', 'server/serve-main.ts'], { stdio: 'inherit', env }),
  spawn('npx', ['vite'], { stdio: 'inherit', env: { ...process.env, API_PORT: apiPort } }),
];
stopOnSignals(async () => {
  for (const child of children) child.kill('SIGTERM');
  await database.stop();
});
