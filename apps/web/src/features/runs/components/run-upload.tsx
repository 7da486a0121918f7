import { useMemo, useState } from 'react';
import { useForm, type Resolver } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Upload, X } from 'lucide-react';
import {
  RUN_KIND,
  RUN_KIND_HINTS,
  RUN_OPTION_KEYS,
  RUN_QUANTITIES,
  runUploadFormSchema,
  type RunDto,
  type RunOptionsFormValues,
  type RunPreview,
  type RunQuantityName,
  type RunUploadForm,
  type RunUploadFormValues,
  type TeardownDto,
} from '@splitcase/contracts';
import { Button } from '@/components/button';
import { ErrorPanel } from '@/components/error-boundary';
import { Field, FormError, Input, LabelledOptions, Select } from '@/components/field';
import { Card } from '@/components/page';
import { ApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { confirmUnpublishFirst, isUnpublishCancelled, isUnpublishRefusal } from '@/lib/unpublish-confirm';
import { usePreviewRun } from '../api/preview-run';
import { useUploadRun } from '../api/upload-run';
import { ColumnMapping, firstUnit } from './column-mapping';
import { LogDropzone } from './log-dropzone';
import { LogPreviewTable } from './log-preview-table';
import { RunOptionFields } from './run-option-fields';
import { formatBytes } from './time-format';
import { UploadProgress } from './upload-progress';

/** The options an upload starts with (a discharge is cut off at 3.0 V unless cleared). */
const START_OPTIONS: RunOptionsFormValues = { cutoffVolts: '3.0', cutoffDebounceSeconds: '', cvVolts: '', terminationFraction: '', material: '', contactSeconds: '', thresholdC: '', cellEnergyWh: '' };

/** The form as the server's first guess fills it. */
function valuesFromPreview(p: RunPreview, fileName: string): RunUploadFormValues {
  const column = (q: RunQuantityName) => p.guess[q] ?? { column: '', unit: firstUnit(q) };
  return {
    label: fileName.replace(/\.[^.]+$/, ''),
    mapping: {
      kind: p.guess.kind,
      time: column('time'),
      voltage: column('voltage'),
      current: column('current'),
      power: column('power'),
      temperature: column('temperature'),
      delimiter: p.delimiter,
      decimalComma: p.decimalComma,
      headerRow: String(p.headerRow),
    },
    options: START_OPTIONS,
  };
}

/** The fields the server may name, as the form names them (the multipart fields label, mapping, options). */
const SERVER_FIELDS = [
  'label',
  ...RUN_QUANTITIES.flatMap((q) => [`mapping.${q}.column`, `mapping.${q}.unit`]),
  'mapping.delimiter',
  'mapping.headerRow',
  'mapping.decimalComma',
  ...RUN_OPTION_KEYS.map((k) => `options.${k}`),
];

/** The form is checked with the schema of the kind chosen (its options only). */
const resolver: Resolver<RunUploadFormValues, unknown, RunUploadForm> = (values, context, options) =>
  zodResolver(runUploadFormSchema(values.mapping.kind))(values, context, options as never) as ReturnType<Resolver<RunUploadFormValues, unknown, RunUploadForm>>;

type RowRefusal = { message: string; row: number; column: string | null };

/** Drop a log, check the columns the server found, map them, upload with progress. */
export function RunUpload({ teardown, onDone, onCancel }: { teardown: TeardownDto; onDone: (run: RunDto) => void; onCancel: () => void }) {
  const [file, setFile] = useState<File | null>(null);
  const preview = usePreviewRun();
  const upload = useUploadRun();
  const [refused, setRefused] = useState<RowRefusal | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<RunUploadFormValues, unknown, RunUploadForm>({ resolver });
  const { register, handleSubmit, reset, setError, setValue, watch, formState } = form;
  const mapping = watch('mapping');
  const kind = mapping?.kind ?? 'discharge';
  const p = preview.data;
  const busy = upload.phase.step === 'uploading' || upload.phase.step === 'analysing';

  const clearMessages = () => {
    setRefused(null);
    setFormError(null);
  };
  const choose = (f: File) => {
    setFile(f);
    clearMessages();
    preview.mutate({ teardownId: teardown.id, file: f }, { onSuccess: (result) => reset(valuesFromPreview(result, f.name)) });
  };
  const chooseAnother = () => {
    setFile(null);
    clearMessages();
    preview.reset();
  };

  const mappedBy = useMemo(() => {
    const m = new Map<string, RunQuantityName>();
    if (mapping) for (const q of RUN_QUANTITIES) if (mapping[q].column) m.set(mapping[q].column, q);
    return m;
  }, [mapping]);

  const failed = (err: unknown) => {
    const details = err instanceof ApiError ? (err.details as { row?: number | null; column?: string | null } | undefined) : undefined;
    if (err instanceof ApiError && err.status >= 400 && err.status < 500 && details?.row) {
      setRefused({ message: err.message, row: details.row, column: details.column ?? null });
      return;
    }
    setFormError(applyServerErrors(err, setError, SERVER_FIELDS));
  };

  const submit = handleSubmit(async (values) => {
    if (!file) return;
    clearMessages();
    // An upload is not simply sent again: a published teardown asks first. If it was published
    // since the page loaded, the server refuses and the same question comes then.
    const send = async (published: boolean) =>
      upload.start({ teardownId: teardown.id, file, ...values, headers: (await confirmUnpublishFirst(published ? { status: 'published' } : teardown)).headers });
    try {
      onDone(await send(false).catch((err: unknown) => (isUnpublishRefusal(err) ? send(true) : Promise.reject(err))));
    } catch (err) {
      if (isUnpublishCancelled(err) || (err as Error).name === 'AbortError') return;
      failed(err);
    }
  });

  const errors = formState.errors;
  return (
    <Card
      title="Add a bench run"
      actions={
        <Button variant="ghost" size="sm" onClick={onCancel} disabled={busy} aria-label="Close the upload">
          <X className="size-4" aria-hidden />
        </Button>
      }
    >
      <div className="space-y-4 p-4">
        {(!file || !p) && <LogDropzone reading={preview.isPending ? (file?.name ?? '') : null} onFile={choose} onRefused={(message) => setFormError(message)} />}
        {preview.isError && <ErrorPanel error={preview.error} />}
        {refused && (
          <div role="alert" className="rounded-lg border border-brick-100 bg-brick-50 p-3 text-sm text-brick-800">
            <p className="font-semibold">
              The log was refused at row {refused.row}
              {refused.column ? `, column “${refused.column}”` : ''}. Nothing was stored.
            </p>
            <p className="mt-1">{refused.message}</p>
          </div>
        )}
        {!p && <FormError message={formError} />}

        {file && p && mapping && (
          <form noValidate onSubmit={submit} className="space-y-4" aria-label="Bench run upload">
            <div className="flex flex-wrap items-center justify-between gap-2 text-sm">
              <p>
                <span className="font-medium">{file.name}</span> <span className="text-graphite-500">· {formatBytes(file.size)}</span>
              </p>
              <Button variant="quiet" size="sm" disabled={busy} onClick={chooseAnother}>
                Choose another file
              </Button>
            </div>

            <div className="grid gap-3 md:grid-cols-[14rem_minmax(0,1fr)]">
              <Field label="Kind of run" hint={RUN_KIND_HINTS[kind]}>
                {(f) => (
                  <Select {...f} disabled={busy} {...register('mapping.kind')}>
                    <LabelledOptions list={RUN_KIND} />
                  </Select>
                )}
              </Field>
              <Field label="Label" error={errors.label?.message} hint="Shown in lists, charts and the report">
                {(f) => <Input {...f} maxLength={160} disabled={busy} {...register('label')} />}
              </Field>
            </div>

            <ColumnMapping kind={kind} columns={p.columns} mapping={mapping} register={register} setValue={setValue} errors={errors.mapping} disabled={busy} />
            <LogPreviewTable preview={p} mappedBy={mappedBy} flaggedColumn={refused?.column ?? null} />

            <fieldset className="grid gap-3 sm:grid-cols-3" disabled={busy}>
              <legend className="mb-1 text-sm font-medium text-graphite-800">Analysis settings</legend>
              <RunOptionFields kind={kind} field={(key) => register(`options.${key}`)} errorOf={(key) => errors.options?.[key]?.message} />
            </fieldset>

            <FormError message={formError} />
            {busy && (upload.phase.step === 'uploading' || upload.phase.step === 'analysing') ? (
              <UploadProgress phase={upload.phase} fileName={file.name} onCancel={upload.cancel} />
            ) : (
              <div className="flex flex-wrap gap-2">
                <Button type="submit" variant="primary" disabled={!mapping.time.column}>
                  <Upload className="size-4" aria-hidden />
                  Upload and analyse
                </Button>
                <Button onClick={onCancel}>Cancel</Button>
              </div>
            )}
          </form>
        )}
      </div>
    </Card>
  );
}
