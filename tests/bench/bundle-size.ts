/**
 * Gzip size of the built client: the entry chunk (the script index.html loads) and every lazy
 * chunk, read from dist/assets after `vite build`. Chart code must stay out of the entry.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';

export interface ChunkSize {
  readonly file: string;
  readonly bytes: number;
  readonly gzipBytes: number;
  /** 'entry': the script index.html runs; 'initial': chunks it preloads with it; 'lazy': fetched on demand. */
  readonly load: 'entry' | 'initial' | 'lazy';
}

const ORDER = { entry: 0, initial: 1, lazy: 2 } as const;

/** Sizes (bytes, gzip level 9) of every JavaScript chunk in `distDir`/assets: entry, initial, then lazy, largest first. */
export function chunkSizes(distDir: string): ChunkSize[] {
  const html = readFileSync(join(distDir, 'index.html'), 'utf8');
  const entries = new Set([...html.matchAll(/<script[^>]+src="\/assets\/([^"]+\.js)"/g)].map((m) => m[1]));
  const preloads = new Set([...html.matchAll(/<link rel="modulepreload"[^>]+href="\/assets\/([^"]+\.js)"/g)].map((m) => m[1]));
  const assets = join(distDir, 'assets');
  return readdirSync(assets)
    .filter((file) => file.endsWith('.js'))
    .map((file) => {
      const content = readFileSync(join(assets, file));
      const load: ChunkSize['load'] = entries.has(file) ? 'entry' : preloads.has(file) ? 'initial' : 'lazy';
      return { file, bytes: content.length, gzipBytes: gzipSync(content, { level: 9 }).length, load };
    })
    .sort((a, b) => ORDER[a.load] - ORDER[b.load] || b.gzipBytes - a.gzipBytes);
}

const kb = (bytes: number): string => `${(bytes / 1024).toFixed(1)} KB`;

/** Builds the client into a temporary folder (or reads `distDir`) and prints the chunk table; returns the sizes. */
export function reportBundleSizes(distDir?: string): ChunkSize[] {
  let dir = distDir;
  let temporary: string | null = null;
  if (!dir || !existsSync(join(dir, 'index.html'))) {
    temporary = mkdtempSync(join(tmpdir(), 'byrecast-bundle-'));
    dir = join(temporary, 'dist');
    const build = spawnSync('npx', ['vite', 'build', '--logLevel', 'error', '--outDir', dir], { stdio: 'inherit' });
    if (build.status !== 0) throw new Error('vite build failed');
  }
  try {
    const sizes = chunkSizes(dir);
    const entry = sizes.filter((s) => s.load !== 'lazy');
    const entryHasCharts = entry.some((s) => readFileSync(join(dir, 'assets', s.file), 'utf8').includes('apexcharts'));
    console.log('\nclient bundle (gzip)');
    for (const s of sizes) console.log(`  ${s.load.padEnd(7)}  ${kb(s.gzipBytes).padStart(9)}  ${s.file}`);
    console.log(`  first load (entry + initial) ${kb(entry.reduce((n, s) => n + s.gzipBytes, 0))}; chart code in it: ${entryHasCharts ? 'YES (should not be)' : 'no'}`);
    return sizes;
  } finally {
    if (temporary) rmSync(temporary, { recursive: true, force: true });
  }
}
