import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { TeardownDto, UploadLimits } from '@splitcase/contracts';
import { ApiError, type RequestOptions } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';
import { confirmUnpublishFirst, isUnpublishCancelled } from '@/lib/unpublish-confirm';
import { uploadPhoto } from '../api/upload-photo';

export type UploadStatus = 'queued' | 'uploading' | 'processing' | 'done' | 'failed' | 'cancelled' | 'refused';

export interface UploadItem {
  key: string;
  file: File;
  layer: number;
  step: number;
  caption?: string;
  status: UploadStatus;
  /** Fraction of the bytes sent, 0..1. */
  progress: number;
  error?: string;
  photoId?: number;
}

const PARALLEL = 2;
let counter = 0;

const mb = (bytes: number) => `${(bytes / 1024 / 1024).toFixed(bytes < 10 * 1024 * 1024 ? 1 : 0)} MB`;

/** The client's check before sending (the server still decides): type by MIME or extension, and size. */
export function precheck(file: File, limits: UploadLimits): string | null {
  const name = file.name.toLowerCase();
  const typeOk = limits.types.some((t) => t.mime === file.type || t.extensions.some((e) => name.endsWith(e)));
  if (!typeOk) return `Not a ${limits.types.map((t) => t.mime.replace('image/', '').toUpperCase()).join(', ')} image`;
  if (file.size > limits.maxBytes) return `${mb(file.size)} is over the ${mb(limits.maxBytes)} limit`;
  if (file.size === 0) return 'The file is empty';
  return null;
}

/**
 * A batch upload queue: two files at a time, a progress per file and overall, cancel and retry per
 * file. An upload cannot simply be sent again, so a published teardown is asked about first
 * (`confirmUnpublishFirst`), once for the files started together.
 */
export function useUploadQueue(teardown: Pick<TeardownDto, 'id' | 'status'>) {
  const teardownId = teardown.id;
  const [items, setItems] = useState<UploadItem[]>([]);
  const aborts = useRef(new Map<string, () => void>());
  const asked = useRef<Promise<Pick<RequestOptions, 'headers'>> | null>(null);
  const qc = useQueryClient();
  // One answer serves the files sent while the teardown is in this state; a new state asks anew.
  useEffect(() => {
    asked.current = null;
  }, [teardown.status]);
  const confirm = useCallback(() => {
    const pending = (asked.current ??= confirmUnpublishFirst(teardown));
    pending.catch(() => {
      if (asked.current === pending) asked.current = null;
    });
    return pending;
  }, [teardown]);

  const patch = useCallback((key: string, change: Partial<UploadItem>) => setItems((all) => all.map((i) => (i.key === key ? { ...i, ...change } : i))), []);

  const add = useCallback((files: File[], limits: UploadLimits, placement: { layer: number; firstStep: number; caption?: string }) => {
    setItems((all) => {
      let step = placement.firstStep;
      const fresh = files.map((file): UploadItem => {
        const refused = precheck(file, limits);
        const item: UploadItem = {
          key: `u${++counter}`,
          file,
          layer: placement.layer,
          step: refused ? 0 : step,
          caption: placement.caption,
          status: refused ? 'refused' : 'queued',
          progress: 0,
          error: refused ?? undefined,
        };
        if (!refused) step += 1;
        return item;
      });
      return [...all, ...fresh];
    });
  }, []);

  const start = useCallback(
    async (item: UploadItem) => {
      patch(item.key, { status: 'uploading', progress: 0, error: undefined });
      let opts: Pick<RequestOptions, 'headers'>;
      try {
        opts = await confirm();
      } catch (err) {
        if (!isUnpublishCancelled(err)) throw err;
        patch(item.key, { status: 'cancelled', error: 'Not sent: the teardown stays published.' });
        return;
      }
      const job = uploadPhoto(
        { teardownId, file: item.file, layer: item.layer, step: item.step, caption: item.caption },
        (f) => patch(item.key, f >= 1 ? { progress: 1, status: 'processing' } : { progress: f }),
        opts.headers,
      );
      aborts.current.set(item.key, job.abort);
      try {
        const { photo } = await job.promise;
        patch(item.key, { status: 'done', progress: 1, photoId: photo.id });
        await qc.invalidateQueries({ queryKey: teardownScope(teardownId) });
      } catch (err) {
        if (err instanceof DOMException && err.name === 'AbortError') patch(item.key, { status: 'cancelled', progress: 0, error: undefined });
        else patch(item.key, { status: 'failed', error: err instanceof ApiError ? err.message : 'The upload failed.' });
      } finally {
        aborts.current.delete(item.key);
      }
    },
    [confirm, patch, qc, teardownId],
  );

  // Start queued files while fewer than PARALLEL are in flight.
  useEffect(() => {
    const active = items.filter((i) => i.status === 'uploading' || i.status === 'processing').length;
    const next = items.filter((i) => i.status === 'queued').slice(0, Math.max(0, PARALLEL - active));
    for (const item of next) void start(item);
  }, [items, start]);

  const cancel = useCallback(
    (key: string) => {
      const abort = aborts.current.get(key);
      if (abort) abort();
      else patch(key, { status: 'cancelled' });
    },
    [patch],
  );
  const retry = useCallback((key: string) => patch(key, { status: 'queued', progress: 0, error: undefined }), [patch]);
  const remove = useCallback((key: string) => setItems((all) => all.filter((i) => i.key !== key)), []);
  const clearFinished = useCallback(() => setItems((all) => all.filter((i) => !['done', 'refused', 'cancelled'].includes(i.status))), []);

  const overall = useMemo(() => {
    const counted = items.filter((i) => i.status !== 'refused' && i.status !== 'cancelled');
    const total = counted.reduce((s, i) => s + i.file.size, 0);
    const sent = counted.reduce((s, i) => s + i.file.size * (i.status === 'done' ? 1 : i.progress), 0);
    return {
      fraction: total ? sent / total : 0,
      done: counted.filter((i) => i.status === 'done').length,
      count: counted.length,
      busy: counted.some((i) => i.status === 'queued' || i.status === 'uploading' || i.status === 'processing'),
    };
  }, [items]);

  return { items, add, cancel, retry, remove, clearFinished, overall };
}
