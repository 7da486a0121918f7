// `npm run bench`: runs every benchmark in this folder, one child process each (so each reports its
// own peak memory), one after the other. Speed and memory targets live here, never in unit tests.
import { spawnSync } from 'node:child_process';
import { readdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const here = dirname(fileURLToPath(import.meta.url));
const only = process.argv.slice(2);
const benches = readdirSync(here)
  .filter((f) => f.endsWith('.ts') && f !== 'index.ts' && !f.endsWith('.d.ts'))
  .filter((f) => only.length === 0 || only.some((o) => f.includes(o)))
  .sort();

let failed = 0;
for (const file of benches) {
  console.log(`\n▶ ${file}`);
  const started = Date.now();
  const result = spawnSync(process.execPath, ['--import', 'tsx', join(here, file)], { stdio: 'inherit', env: process.env });
  const seconds = ((Date.now() - started) / 1000).toFixed(1);
  if (result.status !== 0) {
    failed++;
    console.log(`✗ ${file} failed (exit ${result.status ?? result.signal}) after ${seconds} s`);
  } else console.log(`✓ ${file} in ${seconds} s`);
}
if (benches.length === 0) console.log('No benchmarks found.');
process.exitCode = failed ? 1 : 0;
