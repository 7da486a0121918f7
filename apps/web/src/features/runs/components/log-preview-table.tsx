import { RUN_QUANTITY_LABELS, type RunPreview, type RunQuantityName } from '@splitcase/contracts';

/** The first rows of the log under its header, each column marked with the quantity it is mapped to. */
export function LogPreviewTable({ preview, mappedBy, flaggedColumn }: { preview: RunPreview; mappedBy: Map<string, RunQuantityName>; flaggedColumn: string | null }) {
  return (
    <div>
      <p className="mb-1 text-xs text-graphite-500">
        First {preview.rows.length} rows under the header (row {preview.headerRow}). The whole file is checked when you upload.
      </p>
      {/* Focusable, so the rows can be scrolled from the keyboard. */}
      <div className="max-h-64 overflow-auto rounded-md border border-graphite-150" tabIndex={0} role="region" aria-label="First rows of the log">
        <table className="w-full border-collapse text-xs">
          <caption className="sr-only">Preview of the log</caption>
          <thead className="sticky top-0 bg-graphite-50">
            <tr>
              {preview.columns.map((c) => {
                const q = mappedBy.get(c);
                return (
                  <th key={c} scope="col" className={`border-b border-graphite-150 px-2 py-1 text-left font-semibold ${flaggedColumn === c ? 'bg-brick-50 text-brick-800' : 'text-graphite-700'}`}>
                    <div className="font-mono">{c}</div>
                    <div className={`text-2xs font-medium uppercase tracking-wide ${q ? 'text-copper-700' : 'text-graphite-600'}`}>{q ? RUN_QUANTITY_LABELS[q] : 'not used'}</div>
                  </th>
                );
              })}
            </tr>
          </thead>
          <tbody>
            {preview.rows.map((r, k) => (
              <tr key={k} className="border-b border-graphite-100 last:border-0">
                {preview.columns.map((c, j) => (
                  <td key={c} className={`num px-2 py-0.5 font-mono ${mappedBy.has(c) ? 'text-graphite-900' : 'text-graphite-500'}`}>
                    {r[j] ?? ''}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
