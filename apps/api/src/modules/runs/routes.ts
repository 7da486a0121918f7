import { randomBytes } from 'node:crypto';
import type { Request } from 'express';
import multer from 'multer';
import {
  idParam,
  RUN_PREVIEW_BYTES,
  runLabel,
  runListQuery,
  runListResponse,
  runMappingSchema,
  runOptionsFor,
  runPreviewResponse,
  runResponse,
  runSeriesQuery,
  runSeriesResponse,
  updateRunBody,
  type RunMapping,
  type RunOptions,
} from '@splitcase/contracts';
import type { ZodType } from 'zod';
import type { AppDeps } from '../../http/deps';
import { validationError, zodFields } from '../../http/errors';
import { uploadOne } from '../../http/multipart';
import { route, type RouteDef } from '../../http/route';
import { CONTENT_EDITORS, editableTeardown, readableTeardown } from '../teardowns/access';
import { previewLog } from './preview';
import { deleteRun, editableRun, ingestRun, rawFilePath, readableRun, runSeries, teardownRuns, toRunDto, toRunDtos, updateRun, visibleRuns } from './runs.service';
import { ensureIncomingDir, removeQuietly } from './storage';

/** A JSON text field of a multipart form, validated with its schema; errors name `<field>.<path>`. */
function jsonField<T>(req: Request, field: string, schema: ZodType<T>, required: boolean): T | undefined {
  const raw = (req.body as Record<string, unknown> | undefined)?.[field];
  if (raw === undefined || raw === '') {
    if (required) throw validationError({ [field]: `Send the ${field} as a JSON text field` });
    return undefined;
  }
  let value: unknown;
  try {
    value = JSON.parse(String(raw));
  } catch (err) {
    throw validationError({ [field]: `Not valid JSON: ${(err as Error).message}` });
  }
  const result = schema.safeParse(value);
  if (!result.success) throw validationError(zodFields(result.error, field));
  return result.data;
}

/** Keeps only the first `limit` bytes of an uploaded file in memory and drains the rest (for the column preview). */
function headStorage(limit: number): multer.StorageEngine {
  return {
    _handleFile(_req, file, cb) {
      const chunks: Buffer[] = [];
      let kept = 0;
      let total = 0;
      file.stream.on('data', (chunk: Buffer) => {
        total += chunk.length;
        if (kept < limit) {
          const part = chunk.subarray(0, limit - kept);
          chunks.push(part);
          kept += part.length;
        }
      });
      file.stream.on('error', (err) => cb(err));
      file.stream.on('end', () => cb(null, { buffer: Buffer.concat(chunks), size: total }));
    },
    _removeFile(_req, _file, cb) {
      cb(null);
    },
  };
}

export function runRoutes(deps: AppDeps): RouteDef[] {
  const env = deps.env;
  const upload = uploadOne({
    field: 'file',
    maxBytes: env.runUploadMaxBytes,
    storage: multer.diskStorage({
      destination: (_req, _file, cb) => {
        try {
          cb(null, ensureIncomingDir(env.uploadsDir));
        } catch (err) {
          cb(err as Error, '');
        }
      },
      filename: (_req, _file, cb) => cb(null, `${randomBytes(16).toString('hex')}.part`),
    }),
    fields: 6,
    fieldSize: 64 * 1024,
  });
  const preview = uploadOne({ field: 'file', maxBytes: env.runUploadMaxBytes, storage: headStorage(RUN_PREVIEW_BYTES), fields: 2 });
  const uploadMb = Math.round(env.runUploadMaxBytes / 1024 / 1024);

  return [
    route(
      {
        method: 'post',
        path: '/api/teardowns/:id/runs/preview',
        tag: 'Bench runs',
        summary: `Column preview of a log before the upload: detected delimiter, header row, the first rows and a guessed mapping (only the first ${RUN_PREVIEW_BYTES / 1024} KiB are read)`,
        access: CONTENT_EDITORS,
        params: idParam,
        multipart: { file: 'file' },
        before: [preview],
        response: runPreviewResponse,
      },
      async ({ em, user, params, req }) => {
        await readableTeardown(em, user, params.id);
        const file = req.file;
        if (!file) throw validationError({ file: 'Attach the log file (CSV or TSV)' });
        return previewLog(file.buffer, file.size <= RUN_PREVIEW_BYTES);
      },
    ),
    route(
      {
        method: 'post',
        path: '/api/teardowns/:id/runs',
        tag: 'Bench runs',
        summary: `Upload a bench log (CSV or TSV, up to ${uploadMb} MB) with its column mapping; the server parses it, analyses it and keeps the raw file. Published teardowns need the confirm header.`,
        access: CONTENT_EDITORS,
        params: idParam,
        multipart: { file: 'file', mapping: 'string', label: 'string', options: 'string' },
        before: [upload],
        response: runResponse,
        status: 201,
      },
      async ({ em, user, params, req, confirmUnpublish }) => {
        const file = req.file;
        try {
          if (!file) throw validationError({ file: 'Attach the log file (CSV or TSV)' });
          const mapping = jsonField<RunMapping>(req, 'mapping', runMappingSchema, true)!;
          const options = jsonField<RunOptions>(req, 'options', runOptionsFor(mapping.kind), false);
          const labelText = (req.body as Record<string, unknown>).label;
          let label: string | undefined;
          if (labelText !== undefined && String(labelText).trim() !== '') {
            const parsed = runLabel.safeParse(String(labelText));
            if (!parsed.success) throw validationError(zodFields(parsed.error, 'label'));
            label = parsed.data;
          }
          const teardown = await editableTeardown({ em, user, confirmUnpublish }, params.id);
          const run = await ingestRun(em, env, {
            teardown,
            user,
            incomingPath: file.path,
            originalName: file.originalname || 'log.csv',
            fileBytes: file.size,
            mapping,
            label,
            options,
          });
          return { run: await toRunDto(em, run) };
        } finally {
          // Kept files were moved into the run folder; anything left here is refused input.
          removeQuietly(file?.path);
        }
      },
    ),
    route(
      {
        method: 'get',
        path: '/api/teardowns/:id/runs',
        tag: 'Bench runs',
        summary: 'Runs of a teardown, newest first, with their analysis and the comparison with the label (viewers: published teardowns only)',
        access: 'signed-in',
        params: idParam,
        response: runListResponse,
      },
      async ({ em, user, params }) => {
        const teardown = await readableTeardown(em, user, params.id);
        return { runs: await toRunDtos(em, await teardownRuns(em, teardown)) };
      },
    ),
    route(
      {
        method: 'get',
        path: '/api/runs',
        tag: 'Bench runs',
        summary: 'Runs across the teardowns the caller may read (for overlays), newest first; filter by kind and words',
        access: 'signed-in',
        query: runListQuery,
        response: runListResponse,
      },
      async ({ em, user, query }) => ({ runs: await toRunDtos(em, await visibleRuns(em, user, query)) }),
    ),
    route(
      { method: 'get', path: '/api/runs/:id', tag: 'Bench runs', summary: 'One run with its analysis', access: 'signed-in', params: idParam, response: runResponse },
      async ({ em, user, params }) => ({ run: await toRunDto(em, await readableRun(em, user, params.id)) }),
    ),
    route(
      {
        method: 'get',
        path: '/api/runs/:id/series',
        tag: 'Bench runs',
        summary: 'The series downsampled for a chart (LTTB, at most maxPoints per trace, ≤ 5000); from/to (s) return a window at up to full resolution',
        access: 'signed-in',
        params: idParam,
        query: runSeriesQuery,
        response: runSeriesResponse,
      },
      async ({ em, user, params, query }) => runSeries(env, await readableRun(em, user, params.id), query),
    ),
    route(
      {
        method: 'get',
        path: '/api/runs/:id/raw',
        tag: 'Bench runs',
        summary: 'Download the log as it was uploaded',
        access: 'signed-in',
        params: idParam,
        produces: 'text/csv',
      },
      async ({ em, user, params, res }) => {
        const run = await readableRun(em, user, params.id);
        const path = rawFilePath(env, run);
        if (/\.tsv$/i.test(run.fileName)) res.type('text/tab-separated-values');
        else res.type('text/csv');
        await new Promise<void>((resolve, reject) =>
          res.download(path, run.fileName, { headers: { 'Cache-Control': 'private, no-store' }, dotfiles: 'allow' }, (err) => (err ? reject(err) : resolve())),
        );
        return undefined;
      },
    ),
    route(
      {
        method: 'patch',
        path: '/api/runs/:id',
        tag: 'Bench runs',
        summary: 'Rename a run or change its analysis options (the stored series is analysed again)',
        access: CONTENT_EDITORS,
        params: idParam,
        body: updateRunBody,
        response: runResponse,
      },
      async ({ em, user, params, body, confirmUnpublish }) => {
        const run = await editableRun({ em, user, confirmUnpublish }, params.id);
        // The options of the run's kind only (contracts' RUN_KIND_NEEDS, as the upload).
        const options = body.options && runOptionsFor(run.kind).safeParse(body.options);
        if (options && !options.success) throw validationError(zodFields(options.error, 'options'));
        return { run: await toRunDto(em, await updateRun(em, env, user, run, body)) };
      },
    ),
    route(
      { method: 'delete', path: '/api/runs/:id', tag: 'Bench runs', summary: 'Delete a run and its files', access: CONTENT_EDITORS, params: idParam },
      async ({ em, user, params, confirmUnpublish }) => {
        const run = await editableRun({ em, user, confirmUnpublish }, params.id);
        await deleteRun(em, env, user, run);
        return undefined;
      },
    ),
  ];
}
