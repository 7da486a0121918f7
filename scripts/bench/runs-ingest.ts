// Bench-run ingest at scale: a 1,000,000-row discharge log (and a five-column one) written to disk,
// then parsed, analysed and stored in-process through the same service as an upload
// (ingestRun), then downsampled for a chart. Reports wall time and peak memory (maxRSS).
import { createWriteStream, mkdtempSync, rmSync, statSync } from 'node:fs';
import { once } from 'node:events';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { createSeededRandom, lithiumIonOcv } from '@splitcase/calc';
import type { RunMapping } from '@splitcase/contracts';
import { testEnv } from '../../apps/api/src/config/env';
import { migrate, openOrm } from '../../apps/api/src/db/orm';
import { ingestRun, runSeries } from '../../apps/api/src/modules/runs/runs.service';
import { ensureIncomingDir } from '../../apps/api/src/modules/runs/storage';
import { TeardownSchema } from '../../apps/api/src/modules/teardowns/teardown.entity';
import { SEED_STEPS, seedIfEmpty } from '../../apps/api/src/seed/index';

const ROWS = Number(process.env.BENCH_RUN_ROWS ?? 1_000_000);
const mb = (bytes: number) => `${(bytes / 1024 / 1024).toFixed(1)} MB`;
const maxRss = () => process.resourceUsage().maxRSS * 1024; // maxRSS is in KiB

/**
 * A 3 Ah cell discharged at 1.08 A, logged at 100 Hz for 10 000 s (1,000,000 rows): the model OCV
 * minus I·R with logger noise. Written in 64 KiB chunks, so generating it costs no memory.
 */
async function writeLog(path: string, rows: number, fiveColumns: boolean): Promise<void> {
  const out = createWriteStream(path);
  const rand = createSeededRandom(7);
  const noise = () => (rand() - 0.5) * 0.002;
  out.write(fiveColumns ? 'elapsed_s,voltage_V,current_A,power_W,cell_temp_C\n' : 'elapsed_s,voltage_V,current_A\n');
  const stepS = 10_000 / rows;
  const current = 1.08;
  let chunk = '';
  for (let k = 0; k < rows; k++) {
    const t = k * stepS;
    const soc = Math.max(0, 1 - (current * t) / 3600 / 3);
    const v = lithiumIonOcv(soc) - current * 0.05 + noise();
    const i = current + noise();
    chunk += fiveColumns
      ? `${t.toFixed(2)},${v.toFixed(4)},${i.toFixed(4)},${(v * i).toFixed(4)},${(25 + 6 * (1 - Math.exp(-t / 1800)) + noise() * 50).toFixed(2)}\n`
      : `${t.toFixed(2)},${v.toFixed(4)},${i.toFixed(4)}\n`;
    if (chunk.length > 1 << 16) {
      if (!out.write(chunk)) await once(out, 'drain');
      chunk = '';
    }
  }
  out.end(chunk);
  await once(out, 'finish');
}

const dataDir = mkdtempSync(join(tmpdir(), 'splitcase-bench-runs-'));
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
  const incoming = ensureIncomingDir(env.uploadsDir);

  const results: Record<string, string | number>[] = [];
  for (const fiveColumns of [false, true]) {
    const path = join(incoming, `bench-${fiveColumns ? 5 : 3}.part`);
    await writeLog(path, ROWS, fiveColumns);
    const bytes = statSync(path).size;
    global.gc?.();
    const em = orm.em.fork();
    const teardown = await em.findOneOrFail(TeardownSchema, { id: 1 }, { populate: ['device'] });
    const rssBefore = process.memoryUsage().rss;
    const mapping: RunMapping = {
      kind: 'discharge',
      time: { column: 'elapsed_s', unit: 's' },
      voltage: { column: 'voltage_V', unit: 'V' },
      current: { column: 'current_A', unit: 'A' },
      ...(fiveColumns ? { power: { column: 'power_W', unit: 'W' }, temperature: { column: 'cell_temp_C', unit: '°C' } } : {}),
    };
    const t0 = performance.now();
    const run = await ingestRun(em, env, { teardown, user: null, incomingPath: path, originalName: `bench-${fiveColumns ? 5 : 3}.csv`, fileBytes: bytes, mapping, options: { cutoffVolts: 3.0 } });
    const ingestMs = performance.now() - t0;
    const t1 = performance.now();
    const series = runSeries(env, run, { maxPoints: 2000 });
    const seriesMs = performance.now() - t1;
    const t2 = performance.now();
    runSeries(env, run, { maxPoints: 2000, from: 4000, to: 4010 });
    const windowMs = performance.now() - t2;
    results.push({
      log: `${ROWS.toLocaleString('en-GB')} rows × ${fiveColumns ? 5 : 3} columns`,
      file: mb(bytes),
      'ingest + analyse': `${(ingestMs / 1000).toFixed(2)} s`,
      'rows/s': Math.round(ROWS / (ingestMs / 1000)).toLocaleString('en-GB'),
      'series (2000 pts)': `${seriesMs.toFixed(0)} ms`,
      'zoom window': `${windowMs.toFixed(0)} ms`,
      'RSS before': mb(rssBefore),
      'peak RSS': mb(maxRss()),
      'peak − before': mb(Math.max(0, maxRss() - rssBefore)),
      'Ah (check)': Number(run.analysis.ampHours?.toFixed(4)),
      points: series.traces.v?.t.length ?? 0,
    });
  }
  console.table(results);
  console.log(
    'Peak RSS is the whole process (Node, the ORM and the app modules included) and only ever grows, so the second row includes the first; "RSS before" is the same process with everything loaded, just before the ingest.',
  );
  await orm.close();
} finally {
  rmSync(dataDir, { recursive: true, force: true });
}
