import { useRef, useState } from 'react';
import { toast } from 'sonner';
import { CircleCheck, FileUp, TriangleAlert, X } from 'lucide-react';
import { MOUNT_TYPE, PART_CATEGORY, PART_CSV_COLUMNS, type CsvRowError, type ImportPartsResponse } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { Card } from '@/components/page';
import { ApiError } from '@/lib/api-client';
import { DecodedMarking } from '@/components/decoded-marking';
import { useCommitPartsImport, usePreviewPartsImport } from '../api/import-parts';

const MAX_BYTES = 900_000;

/** CSV import: choose or paste a file, preview it on the server (row-level errors), then commit all or nothing. */
export function ImportPanel({ teardownId, onClose }: { teardownId: number; onClose: () => void }) {
  const [csv, setCsv] = useState('');
  const [fileName, setFileName] = useState<string | null>(null);
  const [mode, setMode] = useState<'append' | 'replace'>('append');
  const [preview, setPreview] = useState<ImportPartsResponse | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [commitErrors, setCommitErrors] = useState<CsvRowError[]>([]);
  const fileInput = useRef<HTMLInputElement>(null);
  const previewImport = usePreviewPartsImport();
  const commit = useCommitPartsImport(teardownId);

  const readFile = async (file: File) => {
    setProblem(null);
    setPreview(null);
    if (file.size > MAX_BYTES) return setProblem(`"${file.name}" is ${(file.size / 1e6).toFixed(1)} MB; the import takes up to 0.9 MB. Split the file.`);
    setFileName(file.name);
    const text = await file.text();
    setCsv(text);
    await runPreview(text);
  };

  const runPreview = async (text = csv) => {
    setProblem(null);
    setCommitErrors([]);
    if (!text.trim()) return setProblem('Choose a file or paste the CSV first.');
    try {
      setPreview(await previewImport.mutateAsync({ teardownId, body: { csv: text, mode } }));
    } catch (err) {
      setPreview(null);
      setProblem(err instanceof ApiError ? (Object.values(err.fields)[0] ?? err.message) : (err as Error).message);
    }
  };

  const runCommit = async () => {
    setProblem(null);
    try {
      const res = await commit.mutateAsync({ teardownId, body: { csv, mode } });
      toast.success(`Imported ${res.imported} part${res.imported === 1 ? '' : 's'}.`);
      onClose();
    } catch (err) {
      if (err instanceof ApiError && err.details && typeof err.details === 'object' && 'errors' in err.details) {
        setCommitErrors((err.details as { errors: CsvRowError[] }).errors);
      }
      setProblem(err instanceof Error ? err.message : 'The import failed.');
    }
  };

  const errors = commitErrors.length ? commitErrors : (preview?.errors ?? []);
  const rowsWithErrors = new Set(errors.map((e) => e.row));

  return (
    <Card
      title="Import parts from CSV"
      actions={
        <button type="button" className="rounded p-1 text-graphite-500 hover:bg-graphite-100" aria-label="Close the import" onClick={onClose}>
          <X className="size-4" />
        </button>
      }
    >
      <div className="space-y-4 p-4 text-sm">
        <p className="text-graphite-600">
          Nothing is saved until you import: the preview checks every row first, and if any row is wrong nothing is imported. Comma, semicolon or tab separated; quoted fields and a UTF-8 BOM are fine.
        </p>
        <div className="grid gap-4 lg:grid-cols-2">
          <div className="space-y-2">
            <input
              ref={fileInput}
              type="file"
              accept=".csv,text/csv,text/plain"
              className="sr-only"
              aria-label="CSV file"
              onChange={(e) => {
                const f = e.target.files?.[0];
                if (f) void readFile(f);
                e.target.value = '';
              }}
            />
            <Button onClick={() => fileInput.current?.click()}>
              <FileUp className="size-4" aria-hidden /> Choose a CSV file
            </Button>
            {fileName && <p className="text-xs text-graphite-500">Read {fileName}</p>}
            <label className="block">
              <span className="mb-1 block text-xs font-medium text-graphite-700">…or paste it here</span>
              <textarea
                value={csv}
                onChange={(e) => {
                  setCsv(e.target.value);
                  setFileName(null);
                  setPreview(null);
                }}
                rows={6}
                spellCheck={false}
                placeholder={'Designators,Category,Description,Marking,Quantity,Mount\nR1,passive,Chip resistor,472,1,smt'}
                className="block w-full rounded-md border border-graphite-200 bg-white px-3 py-2 font-mono text-xs focus:border-copper-500 focus:outline-none focus:ring-2 focus:ring-copper-200"
              />
            </label>
            <fieldset className="flex flex-wrap gap-4">
              <legend className="sr-only">What to do with the current parts</legend>
              <label className="flex items-center gap-2">
                <input type="radio" name="import-mode" checked={mode === 'append'} onChange={() => setMode('append')} /> Add to the current list
              </label>
              <label className="flex items-center gap-2">
                <input type="radio" name="import-mode" checked={mode === 'replace'} onChange={() => setMode('replace')} /> Replace the whole list
              </label>
            </fieldset>
            {mode === 'replace' && <p className="text-xs text-amber-700">Replacing removes the current lines; photo pins linked to them lose their link.</p>}
            <div className="flex gap-2">
              <Button variant="secondary" onClick={() => void runPreview()} busy={previewImport.isPending}>
                Preview
              </Button>
              <Button variant="primary" disabled={!preview?.valid || commit.isPending} busy={commit.isPending} onClick={() => void runCommit()}>
                {preview?.valid ? `Import ${preview.rows.length} part${preview.rows.length === 1 ? '' : 's'}` : 'Import'}
              </Button>
            </div>
          </div>
          <details className="rounded-md border border-graphite-150 bg-graphite-50 p-3 text-xs" open>
            <summary className="cursor-pointer font-medium text-graphite-800">Columns the import reads</summary>
            <p className="mt-2 text-graphite-600">Header names are matched case-insensitively, ignoring spaces, dots, dashes and underscores. Other columns are ignored.</p>
            <table className="mt-2 w-full">
              <thead>
                <tr className="text-left text-graphite-500">
                  <th className="py-0.5 pr-2 font-medium">Header</th>
                  <th className="py-0.5 font-medium">Also read as</th>
                </tr>
              </thead>
              <tbody>
                {PART_CSV_COLUMNS.map((c) => (
                  <tr key={c.key} className="align-top">
                    <td className="py-0.5 pr-2 font-medium text-graphite-800">
                      {c.header}
                      {c.required && <span className="ml-1 text-brick-700">required</span>}
                    </td>
                    <td className="py-0.5 text-graphite-600">
                      {c.key === 'decodedValue' || c.key === 'decodedUnit' ? 'worked out from the marking; the column is not read' : c.aliases.join(', ') || '—'}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
            <p className="mt-2 text-graphite-600">
              <span className="font-medium">Category:</span> {PART_CATEGORY.values.join(', ')} (or their labels; resistor and capacitor read as passive). <span className="font-medium">Mount:</span>{' '}
              {MOUNT_TYPE.values.join(', ')}; blank gives manual for cells, boards, heaters, motors, wires and mechanical parts, SMT otherwise. <span className="font-medium">Quantity:</span> a whole
              number, blank is 1. Row numbers count the header as row 1, as a spreadsheet does.
            </p>
          </details>
        </div>

        {problem && (
          <p role="alert" className="flex items-start gap-2 rounded-md bg-brick-50 px-3 py-2 text-brick-800">
            <TriangleAlert className="mt-0.5 size-4 shrink-0" aria-hidden />
            {problem}
          </p>
        )}

        {preview && (
          <div className="space-y-3" aria-live="polite">
            <p className={`flex items-center gap-2 font-medium ${preview.valid && !commitErrors.length ? 'text-cell-700' : 'text-brick-700'}`}>
              {preview.valid && !commitErrors.length ? <CircleCheck className="size-4" aria-hidden /> : <TriangleAlert className="size-4" aria-hidden />}
              {preview.valid && !commitErrors.length
                ? `${preview.rows.length} row${preview.rows.length === 1 ? '' : 's'} ready to import (separator "${preview.delimiter === '\t' ? 'tab' : preview.delimiter}").`
                : `${errors.length} problem${errors.length === 1 ? '' : 's'} in ${rowsWithErrors.size} row${rowsWithErrors.size === 1 ? '' : 's'}: fix the file and preview again. Nothing will be imported until every row is right.`}
            </p>
            {preview.warnings.map((w) => (
              <p key={w} className="text-xs text-amber-700">
                {w}
              </p>
            ))}
            {errors.length > 0 && (
              <ul className="max-h-48 space-y-0.5 overflow-auto rounded-md border border-brick-100 bg-brick-50 px-3 py-2 text-brick-800" aria-label="Problems in the file">
                {errors.map((e, i) => (
                  <li key={i}>
                    <span className="font-medium">
                      Row {e.row}, {e.column}:
                    </span>{' '}
                    {e.message}
                  </li>
                ))}
              </ul>
            )}
            {preview.rows.length > 0 && (
              <div className="max-h-80 overflow-auto rounded-md border border-graphite-150">
                <table className="w-full text-xs">
                  <caption className="sr-only">Preview of the imported rows</caption>
                  <thead className="sticky top-0 bg-graphite-50 text-left text-graphite-600">
                    <tr>
                      {['Row', 'Designators', 'Category', 'Description', 'Marking', 'Decoded', 'Maker part no.', 'Package', 'Qty', 'Mount'].map((h) => (
                        <th key={h} className="h-7 whitespace-nowrap px-2 font-semibold uppercase tracking-wide">
                          {h}
                        </th>
                      ))}
                    </tr>
                  </thead>
                  <tbody>
                    {preview.rows.map((r) => (
                      <tr key={r.row} className={`h-7 border-t border-graphite-100 ${rowsWithErrors.has(r.row) ? 'bg-brick-50' : ''}`}>
                        <td className="num px-2 text-graphite-500">{r.row}</td>
                        <td className="px-2">{r.part.designators ?? '—'}</td>
                        <td className="px-2">{(PART_CATEGORY.labels as Record<string, string>)[r.part.category] ?? r.part.category}</td>
                        <td className="max-w-64 truncate px-2" title={r.part.description}>
                          {r.part.description}
                        </td>
                        <td className="px-2 font-mono">{r.part.marking ?? '—'}</td>
                        <td className="num whitespace-nowrap px-2">{r.part.decodedReadings.length > 0 ? <DecodedMarking readings={r.part.decodedReadings} /> : '—'}</td>
                        <td className="px-2 font-mono">{r.part.makerPartNumber ?? '—'}</td>
                        <td className="px-2">{r.part.package ?? '—'}</td>
                        <td className="num px-2 text-right">{r.part.quantity ?? '?'}</td>
                        <td className="px-2">{(MOUNT_TYPE.labels as Record<string, string>)[r.part.mount] ?? r.part.mount}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
            )}
          </div>
        )}
      </div>
    </Card>
  );
}
