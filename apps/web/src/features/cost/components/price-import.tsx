import { useState } from 'react';
import { toast } from 'sonner';
import { FileUp, X } from 'lucide-react';
import { COSTED_BOM_COLUMNS, PRICE_CONFIDENCE, PRICE_SOURCE, type PriceImportResult, type PriceImportRow } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { ApiError } from '@/lib/api-client';
import { useImportPrices } from '../api/import-prices';
import { plain } from './display';

type Price = PriceImportRow['after'];
const show = (p: Price | null) =>
  p
    ? `${p.currency} ${p.breaks.map((b) => `${plain(b.minQty)}@${plain(b.unitPrice)}`).join('; ')} · ${PRICE_SOURCE.labels[p.source]} · ${PRICE_CONFIDENCE.labels[p.confidence]} · ${p.priceDate}`
    : 'no price';
const same = (a: Price | null, b: Price) => a !== null && JSON.stringify(a) === JSON.stringify(b);

/** Prices from a CSV with the export's columns: check first (nothing saved), then save every line or none. */
export function PriceImport({ teardownId, onClose }: { teardownId: number; onClose: () => void }) {
  const [file, setFile] = useState<File | null>(null);
  const [preview, setPreview] = useState<PriceImportResult | null>(null);
  const [problems, setProblems] = useState<{ message: string; fields: [string, string][] } | null>(null);
  const run = useImportPrices(teardownId);

  const check = async (f: File) => {
    setFile(f);
    setPreview(null);
    setProblems(null);
    try {
      setPreview(await run.mutateAsync({ file: f, mode: 'preview' }));
    } catch (err) {
      if (err instanceof ApiError) setProblems({ message: err.message, fields: Object.entries(err.fields) });
      else setProblems({ message: err instanceof Error ? err.message : 'The file could not be read.', fields: [] });
    }
  };
  const apply = async () => {
    if (!file) return;
    try {
      const r = await run.mutateAsync({ file, mode: 'apply' });
      toast.success(`${r.saved} price${r.saved === 1 ? '' : 's'} saved from ${file.name}; totals updated.`);
      onClose();
    } catch (err) {
      if (err instanceof ApiError) setProblems({ message: err.message, fields: Object.entries(err.fields) });
    }
  };
  const changed = preview?.rows.filter((r) => !same(r.before, r.after)) ?? [];

  return (
    <section aria-label="Import prices from CSV" className="rounded-lg border border-graphite-150 bg-white p-4 shadow-card">
      <div className="mb-2 flex items-start justify-between gap-3">
        <div>
          <h3 className="text-sm font-semibold">Import prices from CSV</h3>
          <p className="max-w-3xl text-xs text-graphite-500">
            Use the columns of the costed-BOM export (<span className="font-mono">{COSTED_BOM_COLUMNS.slice(0, 2).join(', ')}, currency, breaks, source, confidence, price_date</span>); breaks as{' '}
            <span className="font-mono">minQty@unitPrice</span> separated by <span className="font-mono">;</span>. Lines are matched by designators, else by maker part number. Nothing is saved until
            you apply, and then every line or none.
          </p>
        </div>
        <Button size="sm" variant="ghost" aria-label="Close the price import" onClick={onClose}>
          <X className="size-4" aria-hidden />
        </Button>
      </div>
      <label className="inline-flex h-9 cursor-pointer items-center gap-2 rounded-md px-3.5 text-sm font-medium ring-1 ring-inset ring-graphite-200 hover:bg-graphite-50 focus-within:ring-2 focus-within:ring-copper-500">
        <FileUp className="size-4" aria-hidden />
        {file ? `Check another file (${file.name})` : 'Choose a CSV file'}
        <input
          type="file"
          accept=".csv,text/csv"
          className="sr-only"
          aria-label="Price CSV file"
          onChange={(e) => {
            const f = e.target.files?.[0];
            e.target.value = '';
            if (f) void check(f);
          }}
        />
      </label>
      {run.isPending && <p className="mt-2 text-sm text-graphite-500">Reading the file…</p>}

      {problems && (
        <div role="alert" className="mt-3 rounded-md border border-brick-100 bg-brick-50 p-3 text-sm text-brick-800">
          <p className="font-medium">{problems.message.split('. ')[0]}.</p>
          {problems.fields.length > 0 && (
            <ul className="mt-1 list-disc space-y-0.5 pl-5">
              {problems.fields.map(([k, v]) => (
                <li key={k}>{v}</li>
              ))}
            </ul>
          )}
        </div>
      )}

      {preview && (
        <div className="mt-3 space-y-2">
          <p className="text-sm">
            <strong>{preview.rows.length}</strong> line{preview.rows.length === 1 ? '' : 's'} matched, <strong>{changed.length}</strong> would change
            {preview.skipped.length > 0 && `, ${preview.skipped.length} without a price skipped`}. Nothing is saved yet.
          </p>
          <div className="max-h-72 overflow-auto rounded-md border border-graphite-150">
            <table className="w-full text-sm" aria-label="Prices in the file">
              <thead className="sticky top-0 bg-graphite-50 text-left text-xs uppercase tracking-wide text-graphite-600">
                <tr>
                  <th className="px-2 py-1 font-semibold">Line</th>
                  <th className="px-2 py-1 font-semibold">Part</th>
                  <th className="px-2 py-1 font-semibold">Matched by</th>
                  <th className="px-2 py-1 font-semibold">Now</th>
                  <th className="px-2 py-1 font-semibold">From the file</th>
                </tr>
              </thead>
              <tbody>
                {preview.rows.map((r) => {
                  const diff = !same(r.before, r.after);
                  return (
                    <tr key={r.line} className={`border-t border-graphite-100 ${diff ? 'bg-copper-50/60' : ''}`}>
                      <td className="num px-2 py-1 text-graphite-500">{r.line}</td>
                      <td className="px-2 py-1">
                        <span className="font-mono text-xs">{r.designators ?? ''}</span> {r.description}
                      </td>
                      <td className="px-2 py-1 text-xs">{r.matchedBy === 'makerPartNumber' ? 'maker part number' : r.matchedBy}</td>
                      <td className="px-2 py-1 font-mono text-xs text-graphite-600">{show(r.before)}</td>
                      <td className="px-2 py-1 font-mono text-xs">{diff ? show(r.after) : 'unchanged'}</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
          <div className="flex gap-2">
            <Button variant="primary" busy={run.isPending} disabled={changed.length === 0} onClick={apply}>
              {changed.length === 0 ? 'Nothing to change' : `Save ${preview.rows.length} price${preview.rows.length === 1 ? '' : 's'}`}
            </Button>
            <Button onClick={onClose}>Cancel</Button>
          </div>
        </div>
      )}
    </section>
  );
}
