import { useEffect, useState, type FormEvent } from 'react';
import { Download, Trash2 } from 'lucide-react';
import type { PhotoDto } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { Field, Input, Textarea } from '@/components/field';
import { ApiError } from '@/lib/api-client';
import { formatDate } from '@/lib/format';

export interface PhotoValues {
  caption: string;
  layer: number;
  step: number;
}

const sizeText = (bytes: number) => (bytes >= 1024 * 1024 ? `${(bytes / 1024 / 1024).toFixed(1)} MB` : `${Math.max(1, Math.round(bytes / 1024))} kB`);

/** Caption, layer and step of the photo on the stage; download the original; delete. */
export function PhotoDetails({
  photo,
  canEdit,
  save,
  remove,
}: {
  photo: PhotoDto;
  canEdit: boolean;
  save: { busy: boolean; error: unknown; run: (v: PhotoValues) => void };
  remove: { busy: boolean; run: () => void };
}) {
  const initial = { caption: photo.caption ?? '', layer: photo.layer, step: photo.step };
  const [values, setValues] = useState<PhotoValues>(initial);
  const [confirming, setConfirming] = useState(false);
  useEffect(() => {
    setValues({ caption: photo.caption ?? '', layer: photo.layer, step: photo.step });
    setConfirming(false);
  }, [photo.id, photo.caption, photo.layer, photo.step]);
  const errors = save.error instanceof ApiError ? save.error.fields : {};
  const dirty = values.caption !== initial.caption || values.layer !== initial.layer || values.step !== initial.step;
  const submit = (e: FormEvent) => {
    e.preventDefault();
    save.run(values);
  };
  const facts = (
    <p className="text-xs text-graphite-500">
      <span className="num">
        {photo.width} × {photo.height} px · {sizeText(photo.bytes)}
      </span>{' '}
      · {photo.name} · {photo.uploadedBy ? `${photo.uploadedBy.name}, ` : ''}
      {formatDate(photo.createdAt)}
    </p>
  );
  const download = (
    <a href={photo.urls.original} download={photo.name} className="inline-flex items-center gap-1 text-sm font-medium text-copper-700 hover:underline">
      <Download className="size-3.5" aria-hidden /> Original
    </a>
  );
  if (!canEdit) {
    return (
      <section className="space-y-1.5">
        <h3 className="text-sm font-semibold text-graphite-900">
          Layer {photo.layer}, step {photo.step}
        </h3>
        {photo.caption && <p className="text-sm text-graphite-800">{photo.caption}</p>}
        {facts}
        {download}
      </section>
    );
  }
  return (
    <form onSubmit={submit} className="space-y-3" aria-label="Photo details">
      <Field label="Caption" error={errors.caption}>
        {(p) => <Textarea {...p} rows={2} maxLength={500} value={values.caption} placeholder="What this layer shows" onChange={(e) => setValues({ ...values, caption: e.target.value })} />}
      </Field>
      <div className="grid grid-cols-2 gap-3">
        <Field label="Layer" error={errors.layer}>
          {(p) => <Input {...p} type="number" min={1} max={99} value={values.layer} onChange={(e) => setValues({ ...values, layer: Number(e.target.value) })} />}
        </Field>
        <Field label="Step" error={errors.step}>
          {(p) => <Input {...p} type="number" min={1} max={999} value={values.step} onChange={(e) => setValues({ ...values, step: Number(e.target.value) })} />}
        </Field>
      </div>
      {save.error && !Object.keys(errors).length ? (
        <p className="text-sm text-brick-700" role="alert">
          {(save.error as Error).message}
        </p>
      ) : null}
      {facts}
      <div className="flex flex-wrap items-center gap-2">
        <Button type="submit" size="sm" variant="primary" disabled={!dirty} busy={save.busy}>
          Save photo details
        </Button>
        {download}
        {confirming ? (
          <span className="ml-auto flex items-center gap-1">
            <Button size="sm" variant="danger" busy={remove.busy} onClick={remove.run}>
              Delete photo and pins
            </Button>
            <Button size="sm" variant="ghost" onClick={() => setConfirming(false)}>
              Keep
            </Button>
          </span>
        ) : (
          <Button size="sm" variant="ghost" className="ml-auto" onClick={() => setConfirming(true)} aria-label="Delete photo">
            <Trash2 className="size-3.5" aria-hidden /> Delete
          </Button>
        )}
      </div>
    </form>
  );
}
