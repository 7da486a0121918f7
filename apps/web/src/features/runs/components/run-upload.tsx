import { useEffect, useMemo, useState } from 'react';
import { useDropzone } from 'react-dropzone';
import { FileUp, Upload, X } from 'lucide-react';
import {
  CURRENT_UNIT,
  POWER_UNIT,
  RUN_DELIMITER,
  RUN_KIND,
  RUN_KIND_HINTS,
  RUN_QUANTITIES,
  RUN_QUANTITY_LABELS,
  SURFACE_MATERIAL,
  TEMPERATURE_UNIT,
  TIME_UNIT,
  VOLTAGE_UNIT,
  type RunDelimiter,
  type RunDto,
  type RunKind,
  type RunMapping,
  type RunOptions,
  type RunPreview,
  type RunQuantityName,
  type TeardownDto,
} from '@splitcase/contracts';
import { Button } from '@/components/button';
import { ErrorPanel } from '@/components/error-boundary';
import { Field, Input, Select } from '@/components/field';
import { Card } from '@/components/page';
import { ApiError } from '@/lib/api-client';
import { useSettings } from '@/lib/settings';
import { usePreviewRun } from '../api/preview-run';
import { useUploadRun } from '../api/upload-run';
import { debounceDefaultText, TERMINATION_HINT } from './run-option-text';
import { formatBytes } from './time-format';

const UNIT_OPTIONS: Record<RunQuantityName, { values: readonly string[]; labels: Record<string, string> }> = {
  time: TIME_UNIT,
  voltage: VOLTAGE_UNIT,
  current: CURRENT_UNIT,
  power: POWER_UNIT,
  temperature: TEMPERATURE_UNIT,
};

/** Which columns each kind needs (the server says the same in its validation). */
const NEEDS: Record<RunKind, string> = {
  discharge: 'time, voltage, and current or power',
  charge: 'time, voltage and current',
  thermal: 'time and temperature',
  'power-bank': 'time, voltage, and current or power',
};

type ColumnChoice = { column: string; unit: string };
type MappingDraft = Record<RunQuantityName, ColumnChoice>;

interface OptionsDraft {
  cutoffVolts: string;
  cutoffDebounceSeconds: string;
  cvVolts: string;
  terminationC: string;
  material: string;
  contactSeconds: string;
  thresholdC: string;
  cellEnergyWh: string;
}

const EMPTY_OPTIONS: OptionsDraft = { cutoffVolts: '3.0', cutoffDebounceSeconds: '', cvVolts: '', terminationC: '', material: '', contactSeconds: '', thresholdC: '', cellEnergyWh: '' };

function draftFromGuess(preview: RunPreview): MappingDraft {
  const draft = {} as MappingDraft;
  for (const q of RUN_QUANTITIES) {
    const g = preview.guess[q];
    draft[q] = g ? { column: g.column, unit: g.unit } : { column: '', unit: UNIT_OPTIONS[q].values[0]! };
  }
  return draft;
}

/** A number typed in a field, or undefined when blank; NaN is passed on so the server names the field. */
const numberOrUndefined = (text: string) => (text.trim() === '' ? undefined : Number(text.replace(',', '.')));

function buildOptions(kind: RunKind, o: OptionsDraft): RunOptions {
  if (kind === 'discharge') return { cutoffVolts: numberOrUndefined(o.cutoffVolts), cutoffDebounceSeconds: numberOrUndefined(o.cutoffDebounceSeconds) };
  if (kind === 'charge') return { cvVolts: numberOrUndefined(o.cvVolts), terminationFraction: numberOrUndefined(o.terminationC) };
  if (kind === 'thermal') {
    return {
      material: (o.material || undefined) as RunOptions['material'],
      contactSeconds: numberOrUndefined(o.contactSeconds),
      thresholdC: numberOrUndefined(o.thresholdC),
    };
  }
  return { cellEnergyWh: numberOrUndefined(o.cellEnergyWh) };
}

function ProgressBar({ fraction, label }: { fraction: number | null; label: string }) {
  return (
    <div className="space-y-1">
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={fraction === null ? undefined : Math.round(fraction * 100)}
        className="h-2 overflow-hidden rounded-full bg-graphite-100"
      >
        {fraction === null ? (
          <div className="h-full w-1/3 animate-pulse rounded-full bg-copper-400" />
        ) : (
          <div className="h-full rounded-full bg-copper-500 transition-[width]" style={{ width: `${Math.round(fraction * 100)}%` }} />
        )}
      </div>
    </div>
  );
}

/** Seconds since a moment, ticking once a second (the server phase has no byte count to show). */
function useElapsed(since: number | null): number {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    if (since === null) return;
    const timer = setInterval(() => setNow(Date.now()), 1000);
    return () => clearInterval(timer);
  }, [since]);
  return since === null ? 0 : Math.max(0, Math.round((now - since) / 1000));
}

/** Drop a log, check the columns the server found, map them, upload with progress. */
export function RunUpload({ teardown, onDone, onCancel }: { teardown: TeardownDto; onDone: (run: RunDto) => void; onCancel: () => void }) {
  const [file, setFile] = useState<File | null>(null);
  const preview = usePreviewRun();
  const upload = useUploadRun();
  const [kind, setKind] = useState<RunKind>('discharge');
  const [label, setLabel] = useState('');
  const [mapping, setMapping] = useState<MappingDraft | null>(null);
  const [delimiter, setDelimiter] = useState<RunDelimiter>(',');
  const [decimalComma, setDecimalComma] = useState(false);
  const [headerRow, setHeaderRow] = useState('1');
  const [options, setOptions] = useState<OptionsDraft>(EMPTY_OPTIONS);
  const workspaceDebounce = useSettings().data?.cutoffDebounceSeconds;
  const debounceDefault = debounceDefaultText(workspaceDebounce);
  const debouncePlaceholder = workspaceDebounce === undefined ? '' : String(workspaceDebounce);
  const [error, setError] = useState<ApiError | Error | null>(null);
  const [confirming, setConfirming] = useState(false);

  const choose = (f: File) => {
    setFile(f);
    setError(null);
    setMapping(null);
    setLabel(f.name.replace(/\.[^.]+$/, ''));
    preview.mutate(
      { teardownId: teardown.id, file: f },
      {
        onSuccess: (p) => {
          setMapping(draftFromGuess(p));
          setKind(p.guess.kind);
          setDelimiter(p.delimiter);
          setDecimalComma(p.decimalComma);
          setHeaderRow(String(p.headerRow));
        },
      },
    );
  };

  const dropzone = useDropzone({
    multiple: false,
    accept: { 'text/csv': ['.csv'], 'text/tab-separated-values': ['.tsv'], 'text/plain': ['.txt', '.log', '.dat'] },
    onDropAccepted: (files) => files[0] && choose(files[0]),
    onDropRejected: (rejections) => setError(new Error(`${rejections[0]?.file.name ?? 'That file'} is not a CSV or TSV log. Export the log as text (.csv, .tsv or .txt) and drop it again.`)),
  });

  const fields = error instanceof ApiError ? error.fields : {};
  const details = error instanceof ApiError ? (error.details as { row?: number | null; column?: string | null } | undefined) : undefined;
  const p = preview.data;
  const busy = upload.phase.step === 'uploading' || upload.phase.step === 'analysing';
  const elapsed = useElapsed(upload.phase.step === 'analysing' ? upload.phase.since : null);

  const mappedBy = useMemo(() => {
    const m = new Map<string, RunQuantityName>();
    if (mapping) for (const q of RUN_QUANTITIES) if (mapping[q].column) m.set(mapping[q].column, q);
    return m;
  }, [mapping]);

  const submit = async (confirmUnpublish = false) => {
    if (!file || !mapping) return;
    setError(null);
    setConfirming(false);
    const body: RunMapping = { kind, time: mapping.time as RunMapping['time'], delimiter, decimalComma, headerRow: Number(headerRow) || 1 };
    for (const q of ['voltage', 'current', 'power', 'temperature'] as const) {
      if (mapping[q].column) (body as Record<string, unknown>)[q] = mapping[q];
    }
    try {
      const run = await upload.start({ teardownId: teardown.id, file, mapping: body, label: label.trim() || undefined, options: buildOptions(kind, options), confirmUnpublish });
      onDone(run);
    } catch (err) {
      if ((err as Error).name === 'AbortError') return;
      if (err instanceof ApiError && err.status === 409 && (err.details as { reason?: string } | undefined)?.reason === 'published') {
        setConfirming(true);
        return;
      }
      setError(err as Error);
    }
  };

  const setOption = (key: keyof OptionsDraft) => (e: { target: { value: string } }) => setOptions((o) => ({ ...o, [key]: e.target.value }));

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
        {!file || !mapping ? (
          <div
            {...dropzone.getRootProps()}
            className={`flex min-h-36 cursor-pointer flex-col items-center justify-center gap-2 rounded-lg border-2 border-dashed px-6 py-8 text-center text-sm ${dropzone.isDragActive ? 'border-copper-500 bg-copper-50' : 'border-graphite-200 hover:border-copper-400'}`}
          >
            <input {...dropzone.getInputProps()} aria-label="Log file (CSV or TSV)" />
            <FileUp className="size-8 text-graphite-300" aria-hidden />
            {preview.isPending ? (
              <p className="text-graphite-600">Reading the columns of {file?.name}…</p>
            ) : (
              <>
                <p className="font-medium text-graphite-800">Drop a CSV or TSV log here, or click to choose one</p>
                <p className="text-graphite-500">Electronic load, USB meter or thermocouple logger exports; up to a million rows and more. You map the columns next.</p>
              </>
            )}
          </div>
        ) : null}
        {preview.isError && <ErrorPanel error={preview.error} />}
        {error && !(error instanceof ApiError && error.status >= 400 && error.status < 500 && details?.row) && <ErrorPanel error={error} />}
        {error instanceof ApiError && details?.row && (
          <div role="alert" className="rounded-lg border border-brick-100 bg-brick-50 p-3 text-sm text-brick-800">
            <p className="font-semibold">
              The log was refused at row {details.row}
              {details.column ? `, column “${details.column}”` : ''}. Nothing was stored.
            </p>
            <p className="mt-1">{error.message}</p>
          </div>
        )}

        {file && mapping && p && (
          <>
            <div className="flex flex-wrap items-center justify-between gap-2 text-sm">
              <p>
                <span className="font-medium">{file.name}</span> <span className="text-graphite-500">· {formatBytes(file.size)}</span>
              </p>
              <Button
                variant="quiet"
                size="sm"
                disabled={busy}
                onClick={() => {
                  setFile(null);
                  setMapping(null);
                  setError(null);
                  preview.reset();
                }}
              >
                Choose another file
              </Button>
            </div>

            <div className="grid gap-3 md:grid-cols-[14rem_minmax(0,1fr)]">
              <Field label="Kind of run" hint={RUN_KIND_HINTS[kind]}>
                {(f) => (
                  <Select {...f} value={kind} onChange={(e) => setKind(e.target.value as RunKind)} disabled={busy}>
                    {RUN_KIND.values.map((k) => (
                      <option key={k} value={k}>
                        {RUN_KIND.labels[k]}
                      </option>
                    ))}
                  </Select>
                )}
              </Field>
              <Field label="Label" error={fields.label} hint="Shown in lists, charts and the report">
                {(f) => <Input {...f} value={label} maxLength={160} onChange={(e) => setLabel(e.target.value)} disabled={busy} />}
              </Field>
            </div>

            <fieldset className="space-y-2" disabled={busy}>
              <legend className="text-sm font-medium text-graphite-800">Columns — a {RUN_KIND.labels[kind].toLowerCase()} run needs {NEEDS[kind]}</legend>
              <div className="divide-y divide-graphite-100 rounded-md border border-graphite-150">
                {RUN_QUANTITIES.map((q) => {
                  const colError = fields[`mapping.${q}.column`];
                  const unitError = fields[`mapping.${q}.unit`];
                  const columnId = `run-map-${q}-column`;
                  const unitId = `run-map-${q}-unit`;
                  return (
                    <div key={q} className="grid grid-cols-[6.5rem_minmax(0,1fr)_minmax(0,12rem)] items-start gap-2 px-2 py-1.5">
                      <label htmlFor={columnId} className="pt-2 text-sm font-medium text-graphite-800">
                        {RUN_QUANTITY_LABELS[q]}
                      </label>
                      <div>
                        <Select
                          id={columnId}
                          aria-invalid={Boolean(colError)}
                          value={mapping[q].column}
                          onChange={(e) => setMapping({ ...mapping, [q]: { ...mapping[q], column: e.target.value } })}
                        >
                          <option value="">{q === 'time' ? 'Choose a column' : 'Not logged'}</option>
                          {p.columns.map((c) => (
                            <option key={c} value={c}>
                              {c}
                            </option>
                          ))}
                        </Select>
                        {colError && (
                          <p className="mt-0.5 text-xs text-brick-700" role="alert">
                            {colError}
                          </p>
                        )}
                      </div>
                      <div>
                        <Select
                          id={unitId}
                          aria-label={`${RUN_QUANTITY_LABELS[q]} unit`}
                          aria-invalid={Boolean(unitError)}
                          value={mapping[q].unit}
                          disabled={!mapping[q].column}
                          onChange={(e) => setMapping({ ...mapping, [q]: { ...mapping[q], unit: e.target.value } })}
                        >
                          {UNIT_OPTIONS[q].values.map((u) => (
                            <option key={u} value={u}>
                              {UNIT_OPTIONS[q].labels[u]}
                            </option>
                          ))}
                        </Select>
                        {unitError && (
                          <p className="mt-0.5 text-xs text-brick-700" role="alert">
                            {unitError}
                          </p>
                        )}
                      </div>
                    </div>
                  );
                })}
              </div>
            </fieldset>

            <div className="grid gap-3 sm:grid-cols-3">
              <Field label="Delimiter" error={fields['mapping.delimiter']} hint="Detected from the file">
                {(f) => (
                  <Select {...f} value={delimiter} onChange={(e) => setDelimiter(e.target.value as RunDelimiter)} disabled={busy}>
                    {RUN_DELIMITER.values.map((d) => (
                      <option key={d} value={d}>
                        {RUN_DELIMITER.labels[d]}
                      </option>
                    ))}
                  </Select>
                )}
              </Field>
              <Field label="Header row" error={fields['mapping.headerRow']} hint="Line that holds the column names">
                {(f) => <Input {...f} inputMode="numeric" value={headerRow} onChange={(e) => setHeaderRow(e.target.value)} disabled={busy} />}
              </Field>
              <label className="flex items-center gap-2 self-center pt-4 text-sm">
                <input type="checkbox" checked={decimalComma} onChange={(e) => setDecimalComma(e.target.checked)} disabled={busy} className="size-4 accent-copper-600" />
                Decimal comma (3,712)
              </label>
            </div>
            {fields.decimalComma && <p className="text-sm text-brick-700">{fields.decimalComma}</p>}

            <div>
              <p className="mb-1 text-xs text-graphite-500">
                First {p.rows.length} rows under the header (row {p.headerRow}). The whole file is checked when you upload.
              </p>
              <div className="max-h-64 overflow-auto rounded-md border border-graphite-150">
                <table className="w-full border-collapse text-xs">
                  <caption className="sr-only">Preview of the log</caption>
                  <thead className="sticky top-0 bg-graphite-50">
                    <tr>
                      {p.columns.map((c) => {
                        const q = mappedBy.get(c);
                        const flagged = details?.column === c;
                        return (
                          <th key={c} scope="col" className={`border-b border-graphite-150 px-2 py-1 text-left font-semibold ${flagged ? 'bg-brick-50 text-brick-800' : 'text-graphite-700'}`}>
                            <div className="font-mono">{c}</div>
                            <div className={`text-2xs font-medium uppercase tracking-wide ${q ? 'text-copper-700' : 'text-graphite-400'}`}>{q ? RUN_QUANTITY_LABELS[q] : 'not used'}</div>
                          </th>
                        );
                      })}
                    </tr>
                  </thead>
                  <tbody>
                    {p.rows.map((r, k) => (
                      <tr key={k} className="border-b border-graphite-100 last:border-0">
                        {p.columns.map((c, j) => (
                          <td key={c} className={`num px-2 py-0.5 font-mono ${mappedBy.has(c) ? 'text-graphite-900' : 'text-graphite-400'}`}>
                            {r[j] ?? ''}
                          </td>
                        ))}
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
            </div>

            <fieldset className="grid gap-3 sm:grid-cols-3" disabled={busy}>
              <legend className="mb-1 text-sm font-medium text-graphite-800">Analysis settings</legend>
              {kind === 'discharge' && (
                <>
                  <Field label="Cut-off voltage (V)" error={fields['options.cutoffVolts']} hint="The cell maker's end voltage; Li-ion usually 2.5–3.0 V. Blank: until the load stops.">
                    {(f) => <Input {...f} inputMode="decimal" value={options.cutoffVolts} onChange={setOption('cutoffVolts')} />}
                  </Field>
                  <Field
                    label="Cut-off debounce (s)"
                    error={fields['options.cutoffDebounceSeconds']}
                    hint={`How long the voltage must stay at or under the cut-off; shorter sags at a load step are ignored. Blank: the workspace ${debounceDefault}.`}
                  >
                    {(f) => <Input {...f} inputMode="decimal" value={options.cutoffDebounceSeconds} onChange={setOption('cutoffDebounceSeconds')} placeholder={debouncePlaceholder} />}
                  </Field>
                </>
              )}
              {kind === 'charge' && (
                <>
                  <Field label="Charge voltage (V)" error={fields['options.cvVolts']} hint="Blank: estimated from the top of the log">
                    {(f) => <Input {...f} inputMode="decimal" value={options.cvVolts} onChange={setOption('cvVolts')} placeholder="e.g. 4.2" />}
                  </Field>
                  <Field label="Termination (C)" error={fields['options.terminationFraction']} hint={TERMINATION_HINT}>
                    {(f) => <Input {...f} inputMode="decimal" value={options.terminationC} onChange={setOption('terminationC')} placeholder="0.05" />}
                  </Field>
                </>
              )}
              {kind === 'thermal' && (
                <>
                  <Field label="Surface touched" error={fields['options.material']} hint="Blank: the heater record, else metal">
                    {(f) => (
                      <Select {...f} value={options.material} onChange={setOption('material')}>
                        <option value="">Not given</option>
                        {SURFACE_MATERIAL.values.map((m) => (
                          <option key={m} value={m}>
                            {SURFACE_MATERIAL.labels[m]}
                          </option>
                        ))}
                      </Select>
                    )}
                  </Field>
                  <Field label="Contact time (s)" error={fields['options.contactSeconds']} hint="Blank: the teardown's, else the workspace's">
                    {(f) => <Input {...f} inputMode="numeric" value={options.contactSeconds} onChange={setOption('contactSeconds')} placeholder="e.g. 600" />}
                  </Field>
                  <Field label="Time to a temperature (°C)" error={fields['options.thresholdC']} hint="Optional: when the surface first reaches it">
                    {(f) => <Input {...f} inputMode="decimal" value={options.thresholdC} onChange={setOption('thresholdC')} placeholder="e.g. 45" />}
                  </Field>
                </>
              )}
              {kind === 'power-bank' && (
                <Field label="Cell energy (Wh)" error={fields['options.cellEnergyWh']} hint="Blank: from the pack record, else the label">
                  {(f) => <Input {...f} inputMode="decimal" value={options.cellEnergyWh} onChange={setOption('cellEnergyWh')} />}
                </Field>
              )}
            </fieldset>

            {confirming && (
              <div role="alert" className="space-y-2 rounded-lg border border-amber-100 bg-amber-50 p-3 text-sm text-amber-800">
                <p>This teardown is published. Adding a run moves it back to draft, and it will need review again.</p>
                <div className="flex gap-2">
                  <Button variant="primary" size="sm" onClick={() => submit(true)}>
                    Add the run and move to draft
                  </Button>
                  <Button size="sm" onClick={() => setConfirming(false)}>
                    Keep it published
                  </Button>
                </div>
              </div>
            )}

            {busy ? (
              <div className="space-y-2 rounded-md border border-graphite-100 p-3" aria-live="polite">
                {upload.phase.step === 'uploading' ? (
                  <>
                    <div className="flex justify-between text-sm">
                      <span>1 of 2 · Uploading {file.name}</span>
                      <span className="num">{Math.round(upload.phase.fraction * 100)} %</span>
                    </div>
                    <ProgressBar fraction={upload.phase.fraction} label="Upload" />
                  </>
                ) : (
                  <>
                    <div className="flex justify-between text-sm">
                      <span>2 of 2 · Parsing and analysing on the server</span>
                      <span className="num">{elapsed} s</span>
                    </div>
                    <ProgressBar fraction={null} label="Analysis" />
                    <p className="text-xs text-graphite-500">The whole file is read and checked row by row; a million rows take a few seconds.</p>
                  </>
                )}
                {upload.phase.step === 'uploading' && (
                  <Button size="sm" variant="ghost" onClick={upload.cancel}>
                    Cancel the upload
                  </Button>
                )}
              </div>
            ) : (
              <div className="flex flex-wrap gap-2">
                <Button variant="primary" onClick={() => submit(false)} disabled={!mapping.time.column}>
                  <Upload className="size-4" aria-hidden />
                  Upload and analyse
                </Button>
                <Button onClick={onCancel}>Cancel</Button>
              </div>
            )}
          </>
        )}
      </div>
    </Card>
  );
}
