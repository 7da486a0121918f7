// Bench-log ingest against line length: the same bytes as a normal log (the reference, measured in
// the same run), as one line with no line break, and as wide lines just under the line-length cap.
// Each case runs in its own child process, so its peak memory (maxRSS) is its own. Reported as
// ratios of CPU time (user + system, which other work on a shared machine barely moves; wall time is
// shown too), the fastest of BENCH_REPEAT interleaved runs: a one-line file must cost no more than
// the reference of the same size (it is refused at the first over-long line), and every case must
// grow linearly with the file (2× the bytes ≤ 3× the CPU time; a quadratic parse gives about 4×).
// Exit code 1 when a target is missed.
//   BENCH_LONG_LINE_MB  the smaller size in MB (default 40; the larger is twice that)
//   BENCH_REPEAT        runs of each case (default 3)
import { spawnSync } from 'node:child_process';
import { once } from 'node:events';
import { createWriteStream, mkdtempSync, renameSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { performance } from 'node:perf_hooks';
import type { RunMapping } from '@splitcase/contracts';
import { testEnv } from '../../apps/api/src/config/env';
import { migrate, openOrm } from '../../apps/api/src/db/orm';
import { ingestRun } from '../../apps/api/src/modules/runs/runs.service';
import { ensureIncomingDir } from '../../apps/api/src/modules/runs/storage';
import { TeardownSchema } from '../../apps/api/src/modules/teardowns/teardown.entity';
import { SEED_STEPS, seedIfEmpty } from '../../apps/api/src/seed/index';

type Shape = 'lines' | 'one-line' | 'wide';
const SHAPES: Shape[] = ['lines', 'one-line', 'wide'];
const WIDE_LINE_BYTES = 60 * 1024;
const mb = (bytes: number) => `${(bytes / 1024 / 1024).toFixed(1)} MB`;

/** Writes about `bytes` of log in the given shape, 64 KiB at a time (generating it costs no memory). */
async function writeLog(path: string, bytes: number, shape: Shape): Promise<void> {
  const out = createWriteStream(path);
  const put = async (s: string) => {
    if (!out.write(s)) await once(out, 'drain');
  };
  let written = 0;
  if (shape === 'one-line') {
    // Comma-separated numbers and not one line break: what a logger writing a single record looks like.
    const piece = '4.1234,1.0000,'.repeat(4096);
    await put('elapsed_s,volts,amps,');
    while (written < bytes) {
      await put(piece);
      written += piece.length;
    }
  } else {
    // Wide: 6,500 extra columns of 9-byte cells, so each line is about 60 KiB and the header about 36 KiB.
    const extra = shape === 'wide' ? Math.floor((WIDE_LINE_BYTES - 40) / 9) : 0;
    await put(['elapsed_s', 'volts', 'amps', ...Array.from({ length: extra }, (_, k) => `c${k}`)].join(',') + '\n');
    const tail = extra ? ',' + Array.from({ length: extra }, () => '1.500000').join(',') : '';
    let chunk = '';
    for (let k = 0; written < bytes; k++) {
      const line = `${k},${(4.2 - (k % 100000) * 1e-5).toFixed(5)},1.0000${tail}\n`;
      chunk += line;
      written += line.length;
      if (chunk.length > 1 << 16) {
        await put(chunk);
        chunk = '';
      }
    }
    await put(chunk);
  }
  out.end();
  await once(out, 'finish');
}

/** One case in this process: ingest the file written by the parent through the upload service, report as JSON. */
async function child(shape: Shape, file: string) {
  const dataDir = mkdtempSync(join(tmpdir(), 'splitcase-bench-lines-'));
  try {
    const env = testEnv({ dataDir });
    const orm = await openOrm(env.dbPath);
    await migrate(orm);
    await seedIfEmpty(
      orm,
      env,
      () => {},
      SEED_STEPS.filter((s) => s.name === 'users' || s.name === 'workspace'),
    );
    const path = join(ensureIncomingDir(env.uploadsDir), `bench-${shape}.part`);
    renameSync(file, path);
    const size = statSync(path).size;
    const em = orm.em.fork();
    const teardown = await em.findOneOrFail(TeardownSchema, { id: 1 }, { populate: ['device'] });
    const mapping: RunMapping = { kind: 'discharge', time: { column: 'elapsed_s', unit: 's' }, voltage: { column: 'volts', unit: 'V' }, current: { column: 'amps', unit: 'A' } };
    global.gc?.();
    const rssBefore = process.memoryUsage().rss;
    const t0 = performance.now();
    const cpu0 = process.cpuUsage();
    let outcome: string;
    try {
      const run = await ingestRun(em, env, { teardown, user: null, incomingPath: path, originalName: `bench-${shape}.csv`, fileBytes: size, mapping });
      outcome = `kept, ${run.samples.toLocaleString('en-GB')} samples`;
    } catch (err) {
      outcome = `refused: ${(err as Error).message.slice(0, 70)}`;
    }
    const ms = performance.now() - t0;
    const cpu = process.cpuUsage(cpu0);
    const cpuMs = (cpu.user + cpu.system) / 1000;
    const peak = process.resourceUsage().maxRSS * 1024;
    await orm.close();
    process.stdout.write(`RESULT ${JSON.stringify({ shape, size, ms, cpuMs, rssBefore, peak, outcome })}\n`);
  } finally {
    rmSync(dataDir, { recursive: true, force: true });
  }
}

interface Result {
  shape: Shape;
  size: number;
  ms: number;
  /** CPU time of the ingest (user + system): what the ratios use, as other work on the machine barely moves it. */
  cpuMs: number;
  rssBefore: number;
  peak: number;
  outcome: string;
}

/** Writes the file here (so generating it weighs nothing on the measured process), then ingests it in a child. */
async function runCase(shape: Shape, bytes: number): Promise<Result> {
  const me = fileURLToPath(import.meta.url);
  const dir = mkdtempSync(join(tmpdir(), 'splitcase-bench-log-'));
  const file = join(dir, `${shape}.csv`);
  await writeLog(file, bytes, shape);
  const res = spawnSync(process.execPath, ['--import', 'tsx', me, 'child', shape, file], { encoding: 'utf8', env: process.env, maxBuffer: 1 << 20 });
  rmSync(dir, { recursive: true, force: true });
  const line = res.stdout.split('\n').find((l) => l.startsWith('RESULT '));
  if (!line) throw new Error(`Case ${shape} ${mb(bytes)} failed (exit ${res.status ?? res.signal}):\n${res.stderr}`);
  return JSON.parse(line.slice(7)) as Result;
}

async function parent() {
  const base = Math.round(Number(process.env.BENCH_LONG_LINE_MB ?? 40) * 1024 * 1024);
  // Each case BENCH_REPEAT times (default 3), interleaved; the fastest run of each counts.
  const repeat = Number(process.env.BENCH_REPEAT ?? 3);
  const all: Result[] = [];
  for (let k = 0; k < repeat; k++) for (const factor of [1, 2]) for (const shape of SHAPES) all.push(await runCase(shape, base * factor));
  const results: Result[] = [];
  for (const factor of [1, 2]) {
    for (const shape of SHAPES) {
      const runs = all.filter((r) => r.shape === shape && Math.abs(r.size / base - factor) < 0.2);
      const best = runs.reduce((a, b) => (b.cpuMs < a.cpuMs ? b : a));
      results.push({ ...best, ms: Math.min(...runs.map((r) => r.ms)), peak: Math.min(...runs.map((r) => r.peak - r.rssBefore)) + best.rssBefore });
    }
  }
  const find = (shape: Shape, factor: number) => results.find((r) => r.shape === shape && Math.abs(r.size / base - factor) < 0.2)!;
  const extra = (r: Result) => Math.max(0, r.peak - r.rssBefore);
  console.table(
    results.map((r) => ({
      log: r.shape,
      file: mb(r.size),
      'ingest s': (r.ms / 1000).toFixed(2),
      'CPU s': (r.cpuMs / 1000).toFixed(2),
      'MB/CPU s': (r.size / 1024 / 1024 / (r.cpuMs / 1000)).toFixed(1),
      'peak − before': mb(extra(r)),
      outcome: r.outcome,
    })),
  );
  const failures: string[] = [];
  const rows: Record<string, string>[] = [];
  for (const factor of [1, 2]) {
    const ref = find('lines', factor);
    for (const shape of ['one-line', 'wide'] as const) {
      const r = find(shape, factor);
      const timeRatio = r.cpuMs / ref.cpuMs;
      const memRatio = extra(r) / Math.max(extra(ref), 1);
      rows.push({ check: `${shape} ÷ lines at ${mb(ref.size)}`, 'CPU time': timeRatio.toFixed(3), 'peak memory': memRatio.toFixed(3) });
      if (shape === 'one-line' && timeRatio > 1) failures.push(`one-line at ${mb(r.size)} took ${timeRatio.toFixed(2)}× the CPU time of the reference (target ≤ 1)`);
      if (shape === 'one-line' && extra(r) > extra(ref) + 16 * 1024 * 1024) failures.push(`one-line at ${mb(r.size)} used ${mb(extra(r))} over its start (reference ${mb(extra(ref))})`);
    }
  }
  for (const shape of SHAPES) {
    const small = find(shape, 1);
    const large = find(shape, 2);
    const growth = large.cpuMs / small.cpuMs;
    rows.push({ check: `${shape}: 2× the bytes`, 'CPU time': growth.toFixed(3), 'peak memory': (extra(large) / Math.max(extra(small), 1)).toFixed(3) });
    // A refused one-line file reads the same 64 KiB at every size: its time does not grow at all.
    if (shape !== 'one-line' && growth > 3) failures.push(`${shape}: twice the bytes took ${growth.toFixed(2)}× the CPU time (target ≤ 3, linear ≈ 2)`);
  }
  console.table(rows);
  console.log(
    `Ratios of the same run, fastest of ${repeat}: CPU time of the ingest, and peak memory above the process start (Node, the ORM and the app modules loaded). Linear ≈ 2 at twice the bytes; quadratic ≈ 4.`,
  );
  if (failures.length) {
    for (const f of failures) console.log(`✗ ${f}`);
    process.exitCode = 1;
  } else console.log('✓ one-line logs cost no more than a normal log of the same size, and every shape grows linearly');
}

if (process.argv[2] === 'child') await child(process.argv[3] as Shape, process.argv[4]!);
else await parent();
