// Browser tests: build the web app if needed, then serve it with the API on a free port over a
// throwaway database seeded with the whole demo workspace.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { TestProject } from 'vitest/node';
import { testEnv } from '../../apps/api/src/config/env';
import { startServer, type Running } from '../../apps/api/src/server';
import { ensureWebBuild, webDist } from '../../scripts/web-build';
import { E2E_PASSWORD } from './password';

let running: Running | undefined;
let dataDir: string | undefined;

export async function setup(project: TestProject) {
  ensureWebBuild();
  dataDir = mkdtempSync(join(tmpdir(), 'splitcase-e2e-'));
  const env = testEnv({ dataDir, port: 0, host: '127.0.0.1', demoPassword: E2E_PASSWORD, loginLimitPerIp: 10_000, loginLimitPerAccount: 10_000 });
  running = await startServer(env, { seed: true, webDist, log: () => {} });
  env.publicUrl = running.url;
  project.provide('baseUrl', running.url);
  // Browser tests may add records the UI of their branch cannot make yet (e.g. a power system).
  project.provide('dbPath', env.dbPath);
}

export async function teardown() {
  await running?.close();
  if (dataDir) rmSync(dataDir, { recursive: true, force: true });
}

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
    dbPath: string;
  }
}
