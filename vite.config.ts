import { fileURLToPath, URL } from 'node:url';
import { defineConfig } from 'vitest/config';
import vue from '@vitejs/plugin-vue';

const apiPort = process.env.API_PORT ?? '3001';

export default defineConfig({
  plugins: [vue()],
  resolve: {
    alias: {
      '@': fileURLToPath(new URL('./src', import.meta.url)),
      '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
    },
  },
  server: {
    host: '127.0.0.1',
    port: 5173,
    proxy: { '/api': `http://127.0.0.1:${apiPort}` },
  },
  build: {
    outDir: 'dist',
    chunkSizeWarningLimit: 900,
    rolldownOptions: {
      output: {
        // The chart library (~190 KB gzip) and its own dependencies in one chunk, fetched only by
        // screens with charts. Not recursive: vue3-apexcharts imports Vue, which stays in the entry.
        codeSplitting: {
          groups: [{ name: 'charts', test: /node_modules[\\/](apexcharts|vue3-apexcharts|@svgdotjs|@yr[\\/]monotone-cubic-spline)[\\/]/, includeDependenciesRecursively: false }],
        },
      },
    },
  },
  worker: { format: 'es' },
  test: {
    projects: [
      {
        extends: true,
        // Property tests run thousands of cases: a roomy timeout so a loaded machine does not fail them;
        // speed is measured by `npm run bench`, not here.
        test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], environment: 'node', testTimeout: 30_000 },
      },
      {
        extends: true,
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts'],
          environment: 'node',
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        extends: true,
        test: {
          name: 'browser',
          include: ['tests/browser/**/*.test.ts'],
          environment: 'node',
          testTimeout: 90_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
