// Photo files: sniff the real type, decode with limits, auto-rotate, strip every piece of metadata,
// and keep three files per photo under <uploads>/photos/<storageKey>/ — the re-encoded original, a
// display image and a thumbnail. The files are written to photos/.incoming/<storageKey>/ first and
// moved into place after the row is committed; the start-up sweep clears what a crash leaves.
import { randomBytes } from 'node:crypto';
import { mkdir, rename, rm, writeFile } from 'node:fs/promises';
import { join, resolve, sep } from 'node:path';
import { fileTypeFromBuffer } from 'file-type';
import sharp, { type Metadata } from 'sharp';
import { PHOTO_DISPLAY_PX, PHOTO_THUMB_PX, type PhotoVariant, type UploadLimits } from '@splitcase/contracts';
import { AppError } from '../../http/errors';

/** Decoded images above this many pixels are refused (a small file can declare huge dimensions). */
export const MAX_INPUT_PIXELS = 100_000_000;

type Accepted = { mime: string; ext: string; label: string };

/** HEIC/HEIF is accepted only when this build of sharp (libvips + libheif) can decode it. */
export const heicReadable = (): boolean => {
  const suffixes = (sharp.format.heif?.input as { fileSuffix?: string[] } | undefined)?.fileSuffix ?? [];
  return suffixes.includes('.heic');
};

function acceptedTypes(): Accepted[] {
  const list: Accepted[] = [
    { mime: 'image/jpeg', ext: 'jpg', label: 'JPEG' },
    { mime: 'image/png', ext: 'png', label: 'PNG' },
    { mime: 'image/webp', ext: 'webp', label: 'WebP' },
  ];
  if (heicReadable()) list.push({ mime: 'image/heic', ext: 'heic', label: 'HEIC' });
  return list;
}

export function uploadLimits(maxBytes: number): UploadLimits {
  return {
    maxBytes,
    maxPixels: MAX_INPUT_PIXELS,
    types: acceptedTypes().map((t) => ({
      mime: t.mime,
      extensions: t.ext === 'jpg' ? ['.jpg', '.jpeg'] : t.ext === 'heic' ? ['.heic', '.heif'] : [`.${t.ext}`],
    })),
  };
}

const acceptedList = () =>
  acceptedTypes()
    .map((t) => t.label)
    .join(', ');

/** The real type from the file's first bytes, whatever its name or declared type says; 415 otherwise. */
export async function sniffImage(buffer: Buffer): Promise<Accepted> {
  const found = await fileTypeFromBuffer(buffer);
  const accepted = acceptedTypes();
  const heicFamily = found && (found.mime === 'image/heic' || found.mime === 'image/heif' || found.mime === 'image/heic-sequence' || found.mime === 'image/heif-sequence');
  const match = found && accepted.find((a) => a.mime === found.mime || (heicFamily && a.ext === 'heic'));
  if (!match) {
    const what = found ? `a ${found.ext.toUpperCase()} file (${found.mime})` : 'not an image this server recognises';
    const heicNote = heicFamily ? ' This server cannot decode HEIC: export the photo as JPEG first.' : '';
    throw new AppError('unsupported_media_type', `The file is ${what}. Upload ${acceptedList()}.${heicNote}`, { file: `Not ${acceptedList()}` });
  }
  return match;
}

export interface ProcessedPhoto {
  /** The stored original: same format family, re-encoded without metadata, upright. */
  original: { data: Buffer; mime: string; ext: string };
  display: Buffer;
  thumb: Buffer;
  width: number;
  height: number;
}

const VARIANT_FILES: Record<PhotoVariant, (ext: string) => string> = {
  original: (ext) => `original.${ext}`,
  display: () => 'display.webp',
  thumb: () => 'thumb.webp',
};
export const variantMime = (variant: PhotoVariant, originalMime: string) => (variant === 'original' ? originalMime : 'image/webp');

const pixelLimitError = (w?: number, h?: number) =>
  new AppError(
    'unprocessable',
    `The image is too large to process${w && h ? ` (${w} × ${h} px = ${Math.round((w * h) / 1e6)} megapixels)` : ''}; the limit is ${MAX_INPUT_PIXELS / 1e6} megapixels. Resize it and upload again.`,
    { file: 'Too many pixels' },
  );

/**
 * Decode, auto-rotate from EXIF, and encode the three files. Every output is written by sharp
 * without `keepMetadata`/`withMetadata`, so EXIF (GPS included), XMP, IPTC and ICC data are dropped.
 */
export async function processImage(buffer: Buffer, type: Accepted): Promise<ProcessedPhoto> {
  let meta: Metadata;
  try {
    meta = await sharp(buffer, { limitInputPixels: false }).metadata();
  } catch {
    throw new AppError('unprocessable', `The file looks like ${type.label} but cannot be read as an image (damaged or cut short).`, { file: 'Cannot be decoded' });
  }
  if (meta.width && meta.height && meta.width * meta.height > MAX_INPUT_PIXELS) throw pixelLimitError(meta.width, meta.height);
  const base = sharp(buffer, { limitInputPixels: MAX_INPUT_PIXELS, failOn: 'error', autoOrient: true });
  try {
    const fit = (px: number) => ({ width: px, height: px, fit: 'inside' as const, withoutEnlargement: true });
    const originalPipeline = type.ext === 'png' ? base.clone().png({ compressionLevel: 8 }) : type.ext === 'webp' ? base.clone().webp({ quality: 92 }) : base.clone().jpeg({ quality: 92 });
    const [original, display, thumb] = await Promise.all([
      originalPipeline.toBuffer({ resolveWithObject: true }),
      base.clone().resize(fit(PHOTO_DISPLAY_PX)).webp({ quality: 82, effort: 2 }).toBuffer(),
      base.clone().resize(fit(PHOTO_THUMB_PX)).webp({ quality: 76, effort: 2 }).toBuffer(),
    ]);
    const stored = type.ext === 'png' || type.ext === 'webp' ? type : { mime: 'image/jpeg', ext: 'jpg' };
    return { original: { data: original.data, mime: stored.mime, ext: stored.ext }, display, thumb, width: original.info.width, height: original.info.height };
  } catch (err) {
    const message = (err as Error).message ?? '';
    if (/pixel limit/i.test(message)) throw pixelLimitError(meta.width, meta.height);
    throw new AppError('unprocessable', `The ${type.label} file cannot be decoded: ${message.split('\n')[0]}`, { file: 'Cannot be decoded' });
  }
}

/** File operations, grouped so a test can make one of them fail. */
export const fileOps = { mkdir, writeFile, rm, rename };

/** A fresh storage key: 32 hex characters from the OS random source, never derived from the client's name. */
export const newStorageKey = () => randomBytes(16).toString('hex');

/** Photos live in uploads/photos/<key>/ (bench runs keep their own folder beside it). */
export const photosRoot = (uploadsDir: string) => resolve(uploadsDir, 'photos');

/** Where a photo's files are written before its row is committed. */
export const photosStaging = (uploadsDir: string) => resolve(photosRoot(uploadsDir), '.incoming');

export const STORAGE_KEY = /^[a-f0-9]{32}$/;

function folderOf(uploadsDir: string, storageKey: string, staged = false): string {
  if (!STORAGE_KEY.test(storageKey)) throw new Error(`Bad storage key ${storageKey}`);
  const root = staged ? photosStaging(uploadsDir) : photosRoot(uploadsDir);
  const dir = resolve(root, storageKey);
  if (!dir.startsWith(root + sep)) throw new Error('Storage folder outside uploads');
  return dir;
}

export const variantPath = (uploadsDir: string, storageKey: string, variant: PhotoVariant, originalExt: string) => join(folderOf(uploadsDir, storageKey), VARIANT_FILES[variant](originalExt));

/** Write the three files into a new staging folder; if any write fails, remove the folder and rethrow. */
export async function writePhotoFiles(uploadsDir: string, storageKey: string, p: ProcessedPhoto): Promise<void> {
  const dir = folderOf(uploadsDir, storageKey, true);
  await fileOps.mkdir(photosStaging(uploadsDir), { recursive: true });
  await fileOps.mkdir(dir); // not recursive: fails if the key somehow exists already
  try {
    await fileOps.writeFile(join(dir, VARIANT_FILES.original(p.original.ext)), p.original.data, { flag: 'wx' });
    await fileOps.writeFile(join(dir, VARIANT_FILES.display('')), p.display, { flag: 'wx' });
    await fileOps.writeFile(join(dir, VARIANT_FILES.thumb('')), p.thumb, { flag: 'wx' });
  } catch (err) {
    await removeStagedPhotoFiles(uploadsDir, storageKey);
    throw err;
  }
}

/** After the commit: move the staged folder into place (one rename on the same file system). */
export async function publishPhotoFiles(uploadsDir: string, storageKey: string): Promise<void> {
  await fileOps.rename(folderOf(uploadsDir, storageKey, true), folderOf(uploadsDir, storageKey));
}

export async function removeStagedPhotoFiles(uploadsDir: string, storageKey: string): Promise<void> {
  await fileOps.rm(folderOf(uploadsDir, storageKey, true), { recursive: true, force: true });
}

export async function removePhotoFiles(uploadsDir: string, storageKey: string): Promise<void> {
  await fileOps.rm(folderOf(uploadsDir, storageKey), { recursive: true, force: true });
}

/**
 * The client's file name, kept for display only: no folders (so "../../etc/passwd.jpg" becomes
 * "passwd.jpg"), no control or reserved characters, at most 255 characters.
 */
export function sanitiseFileName(name: string | undefined): string {
  const base = (name ?? '').normalize('NFC').split(/[\\/]/).pop() ?? '';
  const cleaned = base
    .replace(/[\u0000-\u001f\u007f<>:"|?*]/g, '')
    .replace(/^[.\s]+/, '')
    .replace(/\s+/g, ' ')
    .trim();
  return (cleaned || 'photo').slice(0, 255);
}
