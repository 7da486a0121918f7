import { useDropzone } from 'react-dropzone';
import { CircleCheck, CircleX, ImageUp, Loader2, RotateCcw, X } from 'lucide-react';
import type { UploadLimits } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { Field, Input } from '@/components/field';
import type { UploadItem, useUploadQueue } from './use-upload-queue';

const pct = (f: number) => `${Math.round(f * 100)} %`;

function ProgressBar({ fraction, tone = 'copper', label }: { fraction: number; tone?: 'copper' | 'cell' | 'brick'; label: string }) {
  const fill = tone === 'cell' ? 'bg-cell-600' : tone === 'brick' ? 'bg-brick-600' : 'bg-copper-500';
  return (
    <div role="progressbar" aria-label={label} aria-valuemin={0} aria-valuemax={100} aria-valuenow={Math.round(fraction * 100)} className="h-1.5 w-full overflow-hidden rounded-full bg-graphite-100">
      <div className={`h-full rounded-full transition-[width] duration-150 ${fill}`} style={{ width: `${Math.max(0, Math.min(1, fraction)) * 100}%` }} />
    </div>
  );
}

const STATUS_TEXT: Record<UploadItem['status'], string> = {
  queued: 'Waiting',
  uploading: 'Uploading',
  processing: 'Processing on the server',
  done: 'Stored',
  failed: 'Failed',
  cancelled: 'Cancelled',
  refused: 'Not sent',
};

function QueueRow({ item, onCancel, onRetry, onRemove }: { item: UploadItem; onCancel: () => void; onRetry: () => void; onRemove: () => void }) {
  const Icon = item.status === 'done' ? CircleCheck : item.status === 'failed' || item.status === 'refused' ? CircleX : item.status === 'cancelled' ? X : Loader2;
  const iconTone = item.status === 'done' ? 'text-cell-600' : item.status === 'failed' || item.status === 'refused' ? 'text-brick-600' : 'text-graphite-400';
  const shown = item.status === 'done' ? 1 : item.progress;
  return (
    <li className="grid grid-cols-[1.25rem_minmax(0,1fr)_auto] items-center gap-x-3 gap-y-1 py-2" data-testid="upload-row">
      <Icon className={`size-4 ${iconTone} ${item.status === 'uploading' || item.status === 'processing' ? 'animate-spin' : ''}`} aria-hidden />
      <div className="min-w-0">
        <div className="flex items-baseline justify-between gap-3 text-sm">
          <span className="truncate font-medium text-graphite-900" title={item.file.name}>
            {item.file.name}
          </span>
          <span className="num shrink-0 text-xs text-graphite-500">
            {item.status !== 'refused' && item.status !== 'cancelled' && <span data-testid="upload-percent">{pct(shown)}</span>}
            {item.status !== 'refused' && ` · L${item.layer} S${item.step}`}
          </span>
        </div>
        {item.status !== 'refused' && <ProgressBar fraction={shown} tone={item.status === 'done' ? 'cell' : item.status === 'failed' ? 'brick' : 'copper'} label={`Upload of ${item.file.name}`} />}
        <p className={`mt-0.5 text-xs ${item.error ? 'text-brick-700' : 'text-graphite-500'}`} role={item.error ? 'alert' : undefined}>
          {STATUS_TEXT[item.status]}
          {item.error ? `: ${item.error}` : ''}
        </p>
      </div>
      <div className="flex gap-1">
        {(item.status === 'queued' || item.status === 'uploading') && (
          <Button size="sm" variant="ghost" onClick={onCancel} aria-label={`Cancel ${item.file.name}`}>
            Cancel
          </Button>
        )}
        {(item.status === 'failed' || item.status === 'cancelled') && (
          <Button size="sm" variant="ghost" onClick={onRetry} aria-label={`Retry ${item.file.name}`}>
            <RotateCcw className="size-3.5" aria-hidden /> Retry
          </Button>
        )}
        {(item.status === 'refused' || item.status === 'cancelled' || item.status === 'failed') && (
          <Button size="sm" variant="ghost" onClick={onRemove} aria-label={`Remove ${item.file.name} from the list`}>
            <X className="size-3.5" aria-hidden />
          </Button>
        )}
      </div>
    </li>
  );
}

/** Drop zone (or file chooser) plus the queue with per-file and overall progress. */
export function UploadPanel({
  limits,
  queue,
  layer,
  onLayerChange,
  nextStep,
  compact,
}: {
  limits: UploadLimits;
  queue: ReturnType<typeof useUploadQueue>;
  layer: number;
  onLayerChange: (layer: number) => void;
  nextStep: (layer: number) => number;
  compact: boolean;
}) {
  const { getRootProps, getInputProps, isDragActive } = useDropzone({
    onDrop: (files) => queue.add(files, limits, { layer, firstStep: nextStep(layer) }),
    multiple: true,
  });
  const kinds = limits.types.map((t) => t.mime.replace('image/', '').toUpperCase()).join(', ');
  const maxMb = Math.round(limits.maxBytes / 1024 / 1024);
  const { overall } = queue;
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-end gap-3">
        <div
          {...getRootProps({
            className: `flex min-h-11 flex-1 cursor-pointer items-center gap-3 rounded-lg border-2 border-dashed px-4 ${compact ? 'py-2.5' : 'py-6'} text-sm transition-colors ${
              isDragActive ? 'border-copper-500 bg-copper-50' : 'border-graphite-200 bg-white hover:border-copper-400 hover:bg-copper-50/40'
            }`,
            'aria-label': 'Add photos: drop files here or choose them',
          })}
          data-testid="photo-dropzone"
        >
          <input {...getInputProps()} data-testid="photo-file-input" />
          <ImageUp className="size-5 shrink-0 text-copper-600" aria-hidden />
          <div>
            <p className="font-medium text-graphite-900">{isDragActive ? 'Drop to upload' : 'Drop photos here, or click to choose'}</p>
            <p className="text-xs text-graphite-500">
              {kinds} up to {maxMb} MB each. Location and camera data are removed on the server.
            </p>
          </div>
        </div>
        <Field label="Into layer" className="w-28" hint={`next step ${nextStep(layer)}`}>
          {(p) => <Input {...p} type="number" min={1} max={99} value={layer} onChange={(e) => onLayerChange(Math.max(1, Math.min(99, Number(e.target.value) || 1)))} />}
        </Field>
      </div>
      {queue.items.length > 0 && (
        <div className="rounded-lg border border-graphite-150 bg-white px-4 py-2" aria-label="Uploads">
          <div className="flex items-center gap-3 py-1.5 text-sm">
            <span className="font-medium">
              {overall.busy ? 'Uploading' : 'Uploads'} · {overall.done} of {overall.count} stored
            </span>
            <div className="flex-1">
              <ProgressBar fraction={overall.fraction} tone={overall.busy ? 'copper' : 'cell'} label="All uploads" />
            </div>
            <span className="num text-xs text-graphite-600" data-testid="upload-overall">
              {pct(overall.fraction)}
            </span>
            {!overall.busy && (
              <Button size="sm" variant="ghost" onClick={queue.clearFinished}>
                Clear list
              </Button>
            )}
          </div>
          <ul className="divide-y divide-graphite-100 border-t border-graphite-100">
            {queue.items.map((item) => (
              <QueueRow key={item.key} item={item} onCancel={() => queue.cancel(item.key)} onRetry={() => queue.retry(item.key)} onRemove={() => queue.remove(item.key)} />
            ))}
          </ul>
        </div>
      )}
    </div>
  );
}
