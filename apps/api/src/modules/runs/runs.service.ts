// Bench runs: ingest (parse → analyse → keep files → one flush), re-analysis, reads, the downsampled
// series and the DTOs. Uploads and the demo seed go through ingestRun alike.
import { existsSync } from 'node:fs';
import type { EntityManager } from '@mikro-orm/sqlite';
import { lttbIndices } from '@splitcase/calc';
import { RUN_KIND, type RunDto, type RunKind, type RunMapping, type RunOptions, type RunSeries, type RunSeriesQuery } from '@splitcase/contracts';
import type { Env } from '../../config/env';
import { AppError, notFound } from '../../http/errors';
import type { AuthUser } from '../../http/route';
import { diffChanges, recordAudit } from '../audit/audit.service';
import { LoadSchema } from '../power/load.entity';
import { PackSchema } from '../power/pack.entity';
import { getSettings } from '../settings/settings.service';
import { canSee, editableTeardown, visibleTeardowns, type TeardownWriter } from '../teardowns/access';
import type { Teardown } from '../teardowns/teardown.entity';
import { UserSchema } from '../users/user.entity';
import { analyseRun, compareRun, type AnalysisContext } from './analyse';
import { BenchRunSchema, type BenchRun } from './bench-run.entity';
import { parseRunFile } from './parse';
import { sweepFolders, type SweepResult } from '../../lib/leftovers';
import { AuditEntrySchema } from '../audit/audit-entry.entity';
import {
  columnsOf,
  incomingDir,
  newStorageKey,
  publishRunFiles,
  rawPath,
  readSeries,
  readTimes,
  removeRunFiles,
  removeStagedRunFiles,
  runsRoot,
  seriesPath,
  stageRunFiles,
  STORAGE_KEY,
  type StoredSeries,
} from './storage';

const numberOrNull = (x: number | string | null | undefined) => (x === null || x === undefined ? null : Number(x));

/** Everything the analysis and the comparison need about a teardown. */
export async function analysisContext(em: EntityManager, teardown: Teardown): Promise<AnalysisContext> {
  await em.populate(teardown, ['device']);
  const device = teardown.device;
  const pack = await em.findOne(PackSchema, { teardown: teardown.id });
  const heater = await em.findOne(LoadSchema, { teardown: teardown.id, kind: 'heater', surfaceMaterial: { $ne: null } }, { orderBy: { id: 'asc' } });
  const settings = await getSettings(em);
  const discharge = await em.findOne(BenchRunSchema, { teardown: teardown.id, kind: 'discharge' }, { orderBy: { createdAt: 'desc', id: 'desc' } });
  const dischargeWh = discharge?.analysis.wattHours;
  return {
    device: { claimCapacityAh: numberOrNull(device.claimCapacityAh), claimCapacityWh: numberOrNull(device.claimCapacityWh) },
    pack: pack
      ? { cellNominalVolts: Number(pack.cellNominalVolts), cellRatedAh: Number(pack.cellRatedAh), series: pack.series, parallel: pack.parallel }
      : null,
    heaterMaterial: heater?.surfaceMaterial ?? null,
    measuredCells: discharge && typeof dischargeWh === 'number' ? { wattHours: dischargeWh, label: discharge.label } : null,
    teardownContactSeconds: teardown.contactSeconds ?? null,
    defaultContactSeconds: settings.defaultContactSeconds,
    cutoffDebounceSeconds: settings.cutoffDebounceSeconds,
  };
}

/** Drops unset options so the stored JSON says only what the engineer chose. */
function cleanOptions(options: RunOptions | undefined): RunOptions {
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(options ?? {})) if (v !== undefined && v !== null) out[k] = v;
  return out as RunOptions;
}

const defaultLabel = (fileName: string) => fileName.replace(/\.[^.]+$/, '').slice(0, 160) || 'Bench run';

export interface IngestInput {
  teardown: Teardown;
  user: AuthUser | null;
  /** The uploaded file in the incoming folder; moved into the run folder when the run is kept. */
  incomingPath: string;
  originalName: string;
  fileBytes: number;
  mapping: RunMapping;
  label?: string | undefined;
  options?: RunOptions | undefined;
}

/**
 * Parses, analyses and keeps a run, then flushes once (with whatever else the unit of work holds,
 * e.g. a teardown moved back to draft). The files are staged, the row committed, then the files
 * moved into place. On any error nothing is kept: no row, no files.
 */
export async function ingestRun(em: EntityManager, env: Env, input: IngestInput): Promise<BenchRun> {
  const { teardown, mapping } = input;
  const options = cleanOptions(input.options);
  const parsed = await parseRunFile(input.incomingPath, mapping);
  const ctx = await analysisContext(em, teardown);
  const analysis = analyseRun(mapping.kind, parsed.series, options, ctx);
  const storageKey = newStorageKey();
  stageRunFiles(env.uploadsDir, storageKey, input.incomingPath, input.originalName, parsed.series);
  // One transaction: the row needs its id for the audit entry, and a failure undoes both.
  let run: BenchRun;
  await em.begin();
  try {
    run = em.create(BenchRunSchema, {
      teardown,
      kind: mapping.kind,
      label: input.label?.trim() || defaultLabel(input.originalName),
      fileName: input.originalName.slice(0, 255),
      fileBytes: input.fileBytes,
      storageKey,
      mapping: { ...mapping, delimiter: parsed.delimiter },
      samples: parsed.samples,
      durationS: analysis.durationS,
      columns: columnsOf(parsed.series),
      options,
      analysis,
      createdBy: input.user ? em.getReference(UserSchema, input.user.id) : null,
    } as never);
    await em.flush();
    recordAudit(em, input.user, {
      action: 'run.created',
      entityType: 'bench_run',
      entityId: run.id,
      scope: { type: 'teardown', id: teardown.id },
      summary: `Added ${RUN_KIND.labels[mapping.kind].toLowerCase()} run "${run.label}" (${parsed.samples.toLocaleString('en-GB')} samples)`,
    });
    await em.commit();
  } catch (err) {
    await em.rollback();
    removeStagedRunFiles(env.uploadsDir, storageKey);
    throw err;
  }
  try {
    publishRunFiles(env.uploadsDir, storageKey);
  } catch (err) {
    // The files cannot be served: take the row (and its audit entry) back.
    await em.transactional(async (tx) => {
      await tx.nativeDelete(AuditEntrySchema, { entityType: 'bench_run', entityId: String(run.id), action: 'run.created' });
      await tx.nativeDelete(BenchRunSchema, { id: run.id });
    });
    em.getUnitOfWork().unsetIdentity(run);
    removeStagedRunFiles(env.uploadsDir, storageKey);
    throw err;
  }
  return run;
}

/** Start-up: finish or undo run uploads a crash interrupted, drop temporary uploads, and remove folders without a run. */
export async function sweepRunLeftovers(em: EntityManager, uploadsDir: string): Promise<SweepResult> {
  const rows = (await em.getConnection().execute('select storage_key from bench_runs')) as { storage_key: string }[];
  return sweepFolders({ root: runsRoot(uploadsDir), staging: incomingDir(uploadsDir), keys: new Set(rows.map((r) => r.storage_key)), keyPattern: STORAGE_KEY });
}

/** Loads a run with its teardown if the user may read that teardown (404 otherwise, as if it did not exist). */
export async function readableRun(em: EntityManager, user: AuthUser, id: number): Promise<BenchRun> {
  const run = await em.findOne(BenchRunSchema, { id }, { populate: ['teardown', 'teardown.device', 'createdBy'] });
  if (!run || !canSee(user, run.teardown)) throw notFound('The run');
  return run;
}

/** Loads a run for a change: the teardown must be editable by the user (published needs the confirm, in review is refused). */
export async function editableRun(ctx: TeardownWriter, id: number): Promise<BenchRun> {
  const run = await readableRun(ctx.em, ctx.user, id);
  await editableTeardown(ctx, run.teardown.id);
  return run;
}

export async function updateRun(
  em: EntityManager,
  env: Env,
  user: AuthUser,
  run: BenchRun,
  body: { label?: string | undefined; options?: RunOptions | undefined },
): Promise<BenchRun> {
  const before = { label: run.label, options: run.options };
  if (body.label !== undefined) run.label = body.label.trim();
  if (body.options !== undefined) {
    const options = cleanOptions(body.options);
    const { series } = readSeries(seriesPath(env.uploadsDir, run.storageKey));
    const ctx = await analysisContext(em, run.teardown);
    run.analysis = analyseRun(run.kind, series, options, ctx);
    run.durationS = run.analysis.durationS;
    run.options = options;
  }
  const changes = diffChanges(before as Record<string, unknown>, { label: run.label, options: run.options });
  if (Object.keys(changes).length) {
    recordAudit(em, user, {
      action: 'run.updated',
      entityType: 'bench_run',
      entityId: run.id,
      scope: { type: 'teardown', id: run.teardown.id },
      summary: `Changed run "${run.label}": ${Object.keys(changes).join(', ')}${body.options !== undefined ? ' (re-analysed)' : ''}`,
      changes,
    });
  }
  await em.flush();
  return run;
}

export async function deleteRun(em: EntityManager, env: Env, user: AuthUser, run: BenchRun): Promise<void> {
  const storageKey = run.storageKey;
  recordAudit(em, user, {
    action: 'run.deleted',
    entityType: 'bench_run',
    entityId: run.id,
    scope: { type: 'teardown', id: run.teardown.id },
    summary: `Deleted ${RUN_KIND.labels[run.kind].toLowerCase()} run "${run.label}"`,
  });
  em.remove(run);
  await em.flush();
  // Files go once the row is gone: a failed flush keeps both.
  removeRunFiles(env.uploadsDir, storageKey);
}

export async function teardownRuns(em: EntityManager, teardown: Teardown): Promise<BenchRun[]> {
  return em.find(BenchRunSchema, { teardown: teardown.id }, { populate: ['teardown', 'teardown.device', 'createdBy'], orderBy: { createdAt: 'desc', id: 'desc' } });
}

/** Runs the user may read, across teardowns (for overlays), newest first. */
export async function visibleRuns(em: EntityManager, user: AuthUser, filter: { kind?: RunKind | undefined; q?: string | undefined }): Promise<BenchRun[]> {
  const runs = await em.find(
    BenchRunSchema,
    { teardown: visibleTeardowns(user), ...(filter.kind ? { kind: filter.kind } : {}) },
    { populate: ['teardown', 'teardown.device', 'createdBy'], orderBy: { createdAt: 'desc', id: 'desc' }, limit: 500 },
  );
  const words = (filter.q ?? '').toLowerCase().split(/\s+/).filter(Boolean);
  if (!words.length) return runs;
  return runs.filter((r) => {
    const text = `${r.teardown.device.maker} ${r.teardown.device.model} ${r.teardown.unitLabel ?? ''} ${r.label}`.toLowerCase();
    return words.every((w) => text.includes(w));
  });
}

/** DTOs with the comparison worked out now (label, pack and threshold may have changed since the upload). */
export async function toRunDtos(em: EntityManager, runs: BenchRun[]): Promise<RunDto[]> {
  const settings = await getSettings(em);
  const contexts = new Map<number, AnalysisContext>();
  const out: RunDto[] = [];
  for (const run of runs) {
    let ctx = contexts.get(run.teardown.id);
    if (!ctx) {
      ctx = await analysisContext(em, run.teardown);
      contexts.set(run.teardown.id, ctx);
    }
    const device = run.teardown.device;
    out.push({
      id: run.id,
      teardownId: run.teardown.id,
      device: { id: device.id, maker: device.maker, model: device.model },
      unitLabel: run.teardown.unitLabel ?? null,
      teardownStatus: run.teardown.status,
      kind: run.kind,
      label: run.label,
      fileName: run.fileName,
      fileBytes: run.fileBytes,
      mapping: run.mapping as unknown as Record<string, unknown>,
      samples: run.samples,
      durationS: Number(run.durationS),
      columns: run.columns,
      options: run.options,
      analysis: run.analysis,
      comparison: compareRun(run.kind, run.analysis, ctx, settings.capacityWarnFraction),
      createdBy: run.createdBy ? { id: run.createdBy.id, name: run.createdBy.name } : null,
      createdAt: run.createdAt.toISOString(),
      updatedAt: run.updatedAt.toISOString(),
    });
  }
  return out;
}

export async function toRunDto(em: EntityManager, run: BenchRun): Promise<RunDto> {
  return (await toRunDtos(em, [run]))[0]!;
}

/** First index with t ≥ x (binary search on an increasing column). */
function lowerBound(t: Float64Array, x: number): number {
  let lo = 0;
  let hi = t.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if ((t[mid] as number) < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/**
 * The series downsampled for a chart: at most maxPoints per trace (LTTB), over the whole run or a
 * window [from, to] s. The window includes the samples either side so lines reach its edges.
 */
export function runSeries(env: Env, run: BenchRun, query: RunSeriesQuery): RunSeries {
  const path = seriesPath(env.uploadsDir, run.storageKey);
  if (!existsSync(path)) throw new AppError('internal', 'The stored series of this run is missing on the server.');
  const t = readTimes(path);
  const n = t.length;
  const first = t[0] as number;
  const last = t[n - 1] as number;
  let from = 0;
  let to = n;
  if (query.from !== undefined) from = Math.max(0, lowerBound(t, query.from) - 1);
  if (query.to !== undefined) to = Math.min(n, lowerBound(t, query.to) + 1);
  if (to - from < 2) {
    from = Math.max(0, Math.min(from, n - 2));
    to = from + 2;
  }
  const { series } = readSeries(path, { from, to });
  const traces: RunSeries['traces'] = {};
  for (const key of ['v', 'i', 'p', 'temp'] as const) {
    const y = series[key as keyof StoredSeries];
    if (!y) continue;
    const kept = lttbIndices(series.t, y, query.maxPoints);
    traces[key] = { t: kept.map((k) => series.t[k] as number), y: kept.map((k) => y[k] as number) };
  }
  return {
    runId: run.id,
    kind: run.kind,
    range: { fromS: first, toS: last },
    window: { fromS: series.t[0] as number, toS: series.t[series.t.length - 1] as number },
    samplesInWindow: to - from,
    maxPoints: query.maxPoints,
    traces,
    units: { t: 's', v: 'V', i: 'A', p: 'W', temp: '°C' },
  };
}

export const rawFilePath = (env: Env, run: BenchRun) => rawPath(env.uploadsDir, run.storageKey, run.fileName);
