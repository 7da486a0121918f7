/// <reference types="vitest/config" />
import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

const here = (p: string) => fileURLToPath(new URL(p, import.meta.url));
const apiPort = Number(process.env.SPLITCASE_API_PORT ?? 3001);

// One file for the web build (root: apps/web) and for every test project.
export default defineConfig({
  root: here('./apps/web'),
  plugins: [react(), tailwindcss()],
  resolve: { alias: { '@': here('./apps/web/src') } },
  build: {
    outDir: here('./apps/web/dist'),
    emptyOutDir: true,
    chunkSizeWarningLimit: 700,
  },
  server: {
    port: 5173,
    proxy: { '/api': { target: `http://127.0.0.1:${apiPort}`, changeOrigin: false } },
  },
  test: {
    root: here('.'),
    coverage: {
      provider: 'v8',
      include: ['packages/calc/src/**/*.ts'],
      exclude: ['**/*.test.ts', '**/test-support/**'],
      reporter: ['text-summary', 'json-summary'],
      thresholds: { lines: 95 },
    },
    projects: [
      {
        test: {
          name: 'calc',
          root: here('./packages/calc'),
          include: ['src/**/*.test.ts'],
          environment: 'node',
        },
      },
      {
        test: {
          name: 'contracts',
          root: here('./packages/contracts'),
          include: ['src/**/*.test.ts'],
          environment: 'node',
        },
      },
      {
        resolve: { alias: { '@': here('./apps/api/src') } },
        test: {
          name: 'api',
          root: here('.'),
          include: ['apps/api/src/**/*.test.ts', 'tests/api/**/*.test.ts'],
          environment: 'node',
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        resolve: { alias: { '@': here('./apps/web/src') } },
        test: {
          name: 'web',
          root: here('.'),
          include: ['apps/web/src/**/*.test.ts', 'tests/lint/**/*.test.ts'],
          environment: 'node',
        },
      },
      {
        test: {
          name: 'e2e',
          root: here('.'),
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          globalSetup: [here('./tests/e2e/global-setup.ts')],
          setupFiles: [here('./tests/e2e/failure-screenshots.ts')],
          testTimeout: 90_000,
          hookTimeout: 180_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
