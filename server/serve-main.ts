// The API process of `npm run dev`: DATABASE_URL comes from the parent.
import { loadConfig } from './config.js';
import { startServer } from './serve.js';

const url = process.env.DATABASE_URL;
if (!url) throw new Error('DATABASE_URL is required');
const running = await startServer({ databaseUrl: url, config: loadConfig(), seedDemo: true });
console.log(`API on ${running.url}`);
