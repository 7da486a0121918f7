// Bench runs: ingest (parse → analyse → keep files → one flush), re-analysis, reads, the downsampled
// series and the DTOs. Uploads and the demo seed go through ingestRun alike.
import { existsSync } from 'node:fs';
import type { FilterQuery } from '@mikro-orm/core';
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
import { findInChunks, refId } from '../../db/batch';
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

/**
 * Everything the analysis and the comparison need about each teardown (keyed by id), in a fixed
 * number of queries whatever the count: the devices, the packs, the heaters with a surface
 * material, the settings, the discharge runs.
 */
export async function analysisContexts(em: EntityManager, teardowns: Teardown[]): Promise<Map<number, AnalysisContext>> {
  const out = new Map<number, AnalysisContext>();
  if (!teardowns.length) return out;
  await em.populate(teardowns, ['device']);
  const ids = [...new Set(teardowns.map((t) => t.id))];
  const packs = await findInChunks(ids, (chunk) => em.find(PackSchema, { teardown: { $in: chunk } }));
  const heaters = await findInChunks(ids, (chunk) => em.find(LoadSchema, { teardown: { $in: chunk }, kind: 'heater', surfaceMaterial: { $ne: null } }, { orderBy: { id: 'asc' } }));
  const settings = await getSettings(em);
  const discharges = await findInChunks(ids, (chunk) => em.find(BenchRunSchema, { teardown: { $in: chunk }, kind: 'discharge' }, { orderBy: { createdAt: 'desc', id: 'desc' } }));
  const packOf = new Map(packs.map((p) => [refId(p.teardown), p]));
  // In their order (first heater by id, latest discharge run): the first row seen for a teardown counts.
  const firstOf = <T extends { teardown: unknown }>(rows: T[]) => {
    const m = new Map<number, T>();
    for (const r of rows) if (!m.has(refId(r.teardown))) m.set(refId(r.teardown), r);
    return m;
  };
  const heaterOf = firstOf(heaters);
  const dischargeOf = firstOf(discharges);
  for (const teardown of teardowns) {
    const device = teardown.device;
    const pack = packOf.get(teardown.id);
    const discharge = dischargeOf.get(teardown.id);
    const dischargeWh = discharge?.analysis.wattHours;
    out.set(teardown.id, {
      device: { claimCapacityAh: numberOrNull(device.claimCapacityAh), claimCapacityWh: numberOrNull(device.claimCapacityWh) },
      pack: pack ? { cellNominalVolts: Number(pack.cellNominalVolts), cellRatedAh: Number(pack.cellRatedAh), series: pack.series, parallel: pack.parallel } : null,
      heaterMaterial: heaterOf.get(teardown.id)?.surfaceMaterial ?? null,
      measuredCells: discharge && typeof dischargeWh === 'number' ? { wattHours: dischargeWh, label: discharge.label } : null,
      teardownContactSeconds: teardown.contactSeconds ?? null,
      defaultContactSeconds: settings.defaultContactSeconds,
      cutoffDebounceSeconds: settings.cutoffDebounceSeconds,
    });
  }
  return out;
}

/** Everything the analysis and the comparison need about one teardown. */
export async function analysisContext(em: EntityManager, teardown: Teardown): Promise<AnalysisContext> {
  return (await analysisContexts(em, [teardown])).get(teardown.id)!;
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
    });
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

export async function updateRun(em: EntityManager, env: Env, user: AuthUser, run: BenchRun, body: { label?: string | undefined; options?: RunOptions | undefined }): Promise<BenchRun> {
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

/** At most this many runs in a list across teardowns. */
export const RUN_LIST_LIMIT = 500;

/** The text a run is found by: maker, model, unit label and run label. */
const runText = (r: BenchRun) => `${r.teardown.device.maker} ${r.teardown.device.model} ${r.teardown.unitLabel ?? ''} ${r.label}`.toLowerCase();

/**
 * A LIKE pattern that finds at least every text containing the word case-insensitively: SQLite's
 * LIKE folds ASCII letters only, so any other character (and the word's own % and _) stands for
 * any character here, and the exact rule is checked on the rows found.
 */
const likeAtLeast = (word: string) => `%${word.replace(/[^\x20-\x7e]/gu, '_')}%`;

/**
 * Runs the user may read, across teardowns (for overlays), newest first, at most RUN_LIST_LIMIT.
 * Every word must be in the maker, model, unit label or run label (case-insensitive); the words
 * are looked for in SQL, over all runs, not only the latest.
 */
export async function visibleRuns(em: EntityManager, user: AuthUser, filter: { kind?: RunKind | undefined; q?: string | undefined }): Promise<BenchRun[]> {
  const words = (filter.q ?? '').toLowerCase().split(/\s+/).filter(Boolean);
  const where: FilterQuery<BenchRun> = {
    teardown: visibleTeardowns(user),
    ...(filter.kind ? { kind: filter.kind } : {}),
    ...(words.length
      ? {
          $and: words.map((w) => {
            const like = { $like: likeAtLeast(w) };
            return { $or: [{ label: like }, { teardown: { unitLabel: like } }, { teardown: { device: { maker: like } } }, { teardown: { device: { model: like } } }] };
          }),
        }
      : {}),
  };
  const out: BenchRun[] = [];
  // One query in the usual case; more pages only when the pattern found rows the exact rule refuses.
  for (let offset = 0; out.length < RUN_LIST_LIMIT; offset += RUN_LIST_LIMIT) {
    const page = await em.find(BenchRunSchema, where, {
      populate: ['teardown', 'teardown.device', 'createdBy'],
      orderBy: { createdAt: 'desc', id: 'desc' },
      limit: RUN_LIST_LIMIT,
      offset,
    });
    for (const r of page) if (out.length < RUN_LIST_LIMIT && words.every((w) => runText(r).includes(w))) out.push(r);
    if (page.length < RUN_LIST_LIMIT) break;
  }
  return out;
}

/** DTOs with the comparison worked out now (label, pack and threshold may have changed since the upload). */
export async function toRunDtos(em: EntityManager, runs: BenchRun[]): Promise<RunDto[]> {
  const settings = await getSettings(em);
  const contexts = await analysisContexts(
    em,
    runs.map((r) => r.teardown),
  );
  const out: RunDto[] = [];
  for (const run of runs) {
    const ctx = contexts.get(run.teardown.id)!;
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
