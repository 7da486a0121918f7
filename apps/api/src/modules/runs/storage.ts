// Files of a bench run: the raw log as uploaded and the parsed series as Float64 columns, both under
// uploads/runs/<storageKey>/. Incoming uploads land in uploads/runs/.incoming/ (same file system,
// so keeping one is a rename) and are removed whatever happens to the request. A kept run is
// staged in uploads/runs/.incoming/<storageKey>/ and moved into place after its row is committed;
// the start-up sweep clears what a crash leaves there.
import { closeSync, mkdirSync, openSync, readSync, renameSync, rmSync, writeSync, fstatSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import { extname, join } from 'node:path';
import type { RunColumns } from './bench-run.entity';

export interface StoredSeries {
  t: Float64Array;
  v?: Float64Array;
  i?: Float64Array;
  p?: Float64Array;
  temp?: Float64Array;
}

const VALUE_KEYS = ['v', 'i', 'p', 'temp'] as const;
type ValueKey = (typeof VALUE_KEYS)[number];

/** "SCRUNS01", then uint32 samples and uint32 column mask, then t and each present column (Float64, platform byte order: little-endian on the machines we run on). */
const MAGIC = Buffer.from('SCRUNS01', 'latin1');
const HEADER_BYTES = 16;

export const runsRoot = (uploadsDir: string) => join(uploadsDir, 'runs');
export const incomingDir = (uploadsDir: string) => join(runsRoot(uploadsDir), '.incoming');
export const runDir = (uploadsDir: string, storageKey: string) => join(runsRoot(uploadsDir), storageKey);
export const seriesPath = (uploadsDir: string, storageKey: string) => join(runDir(uploadsDir, storageKey), 'series.f64');

/** The raw file keeps a safe extension only. */
export function rawName(originalName: string): string {
  const ext = extname(originalName).toLowerCase();
  return `raw${['.csv', '.tsv', '.txt', '.log', '.dat'].includes(ext) ? ext : '.txt'}`;
}
export const rawPath = (uploadsDir: string, storageKey: string, originalName: string) => join(runDir(uploadsDir, storageKey), rawName(originalName));

export const newStorageKey = () => randomBytes(16).toString('hex');

export function ensureIncomingDir(uploadsDir: string): string {
  const dir = incomingDir(uploadsDir);
  mkdirSync(dir, { recursive: true });
  return dir;
}

export function columnsOf(series: StoredSeries): RunColumns {
  return { v: Boolean(series.v), i: Boolean(series.i), p: Boolean(series.p), temp: Boolean(series.temp) };
}

function writeAll(fd: number, bytes: Uint8Array): void {
  let written = 0;
  while (written < bytes.byteLength) written += writeSync(fd, bytes, written, bytes.byteLength - written);
}

function readAll(fd: number, into: Uint8Array, position: number): void {
  let read = 0;
  while (read < into.byteLength) {
    const got = readSync(fd, into, read, into.byteLength - read, position + read);
    if (got === 0) throw new Error('The stored series file is shorter than its header says.');
    read += got;
  }
}

const bytesOf = (a: Float64Array) => new Uint8Array(a.buffer, a.byteOffset, a.byteLength);

export const STORAGE_KEY = /^[a-f0-9]{32}$/;

/** Where a run's files are written before its row is committed. */
export const stagedRunDir = (uploadsDir: string, storageKey: string) => {
  if (!STORAGE_KEY.test(storageKey)) throw new Error(`Bad storage key ${storageKey}`);
  return join(incomingDir(uploadsDir), storageKey);
};

/** File moves, grouped so a test can make one fail or stop the process at one. */
export const runFileOps = { rename: renameSync };

/** Stages a run: writes the series into a new staging folder and moves the incoming raw file beside it. */
export function stageRunFiles(uploadsDir: string, storageKey: string, incomingPath: string, originalName: string, series: StoredSeries): void {
  const dir = stagedRunDir(uploadsDir, storageKey);
  mkdirSync(dir, { recursive: true });
  try {
    writeSeries(join(dir, 'series.f64'), series);
    runFileOps.rename(incomingPath, join(dir, rawName(originalName)));
  } catch (err) {
    rmSync(dir, { recursive: true, force: true });
    throw err;
  }
}

/** After the commit: move the staged folder into place (one rename on the same file system). */
export function publishRunFiles(uploadsDir: string, storageKey: string): void {
  runFileOps.rename(stagedRunDir(uploadsDir, storageKey), runDir(uploadsDir, storageKey));
}

export function removeStagedRunFiles(uploadsDir: string, storageKey: string): void {
  rmSync(stagedRunDir(uploadsDir, storageKey), { recursive: true, force: true });
}

export function writeSeries(path: string, series: StoredSeries): void {
  const n = series.t.length;
  let mask = 0;
  VALUE_KEYS.forEach((k, bit) => {
    if (series[k]) mask |= 1 << bit;
  });
  const header = Buffer.alloc(HEADER_BYTES);
  MAGIC.copy(header, 0);
  header.writeUInt32LE(n, 8);
  header.writeUInt32LE(mask, 12);
  const fd = openSync(path, 'w');
  try {
    writeAll(fd, header);
    writeAll(fd, bytesOf(series.t));
    for (const k of VALUE_KEYS) {
      const column = series[k];
      if (column) writeAll(fd, bytesOf(column));
    }
  } finally {
    closeSync(fd);
  }
}

/** Reads a stored series, whole or only the samples [from, to) of every column. */
export function readSeries(path: string, range?: { from: number; to: number }): { series: StoredSeries; samples: number } {
  const fd = openSync(path, 'r');
  try {
    const header = Buffer.alloc(HEADER_BYTES);
    readAll(fd, header, 0);
    if (!header.subarray(0, 8).equals(MAGIC)) throw new Error('The stored series file is not in the expected format.');
    const n = header.readUInt32LE(8);
    const mask = header.readUInt32LE(12);
    const expected = HEADER_BYTES + 8 * n * (1 + VALUE_KEYS.filter((_, bit) => mask & (1 << bit)).length);
    if (fstatSync(fd).size !== expected) throw new Error('The stored series file has the wrong length.');
    const from = range ? Math.max(0, Math.min(range.from, n)) : 0;
    const to = range ? Math.max(from, Math.min(range.to, n)) : n;
    const read = (columnIndex: number) => {
      const out = new Float64Array(to - from);
      readAll(fd, bytesOf(out), HEADER_BYTES + columnIndex * n * 8 + from * 8);
      return out;
    };
    const series: StoredSeries = { t: read(0) };
    let columnIndex = 1;
    VALUE_KEYS.forEach((k, bit) => {
      if (mask & (1 << bit)) series[k as ValueKey] = read(columnIndex++);
    });
    return { series, samples: n };
  } finally {
    closeSync(fd);
  }
}

/** Only the time column (for finding a window). */
export function readTimes(path: string): Float64Array {
  const fd = openSync(path, 'r');
  try {
    const header = Buffer.alloc(HEADER_BYTES);
    readAll(fd, header, 0);
    if (!header.subarray(0, 8).equals(MAGIC)) throw new Error('The stored series file is not in the expected format.');
    const n = header.readUInt32LE(8);
    const t = new Float64Array(n);
    readAll(fd, bytesOf(t), HEADER_BYTES);
    return t;
  } finally {
    closeSync(fd);
  }
}

export function removeRunFiles(uploadsDir: string, storageKey: string): void {
  rmSync(runDir(uploadsDir, storageKey), { recursive: true, force: true });
}

export function removeQuietly(path: string | undefined): void {
  if (path) rmSync(path, { force: true });
}
