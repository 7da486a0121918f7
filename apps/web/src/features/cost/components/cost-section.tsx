import { lazy, Suspense, useCallback, useRef, useState, type ReactNode } from 'react';
import { Calculator, Download, FileUp, TriangleAlert } from 'lucide-react';
import type { CostLine, CostRollUpDto, TeardownDto } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { ErrorPanel, WidgetBoundary } from '@/components/error-boundary';
import { Card, EmptyState, Spinner } from '@/components/page';
import { ApiError } from '@/lib/api-client';
import { formatDate, formatPercent } from '@/lib/format';
import { costCsvUrl } from '../api/export-cost-csv';
import { useCost } from '../api/get-cost';
import { useRates } from '../api/rates';
import { CostBomTable } from './cost-bom-table';
import { CostSteps, RatesUsed, VolumeTable } from './cost-details';
import { salesTaxText } from '@/lib/sales-tax';
import { money, ratesOf } from './display';
import { PriceEditor } from './price-editor';
import { PriceImport } from './price-import';
import { TeardownModelCard } from './teardown-model-card';

const CostCharts = lazy(() => import('./cost-charts'));

function Figure({ label, value, sub, strong = false, loss = false, testId }: { label: string; value: ReactNode; sub?: ReactNode; strong?: boolean; loss?: boolean; testId?: string }) {
  return (
    <div className={`rounded-lg border bg-white px-4 py-3 shadow-card ${strong ? 'border-copper-200' : 'border-graphite-150'}`}>
      <div className="text-xs font-medium uppercase tracking-wide text-graphite-500">{label}</div>
      <div className={`num mt-0.5 text-xl font-semibold ${loss ? 'text-brick-700' : strong ? 'text-copper-800' : 'text-graphite-950'}`} data-testid={testId}>
        {value}
      </div>
      {sub && <div className="mt-0.5 text-xs text-graphite-500">{sub}</div>}
    </div>
  );
}

/** The implied margin: a number only when every line is priced; otherwise "Incomplete" with the reason. */
function MarginFigure({ cost }: { cost: CostRollUpDto }) {
  const cur = cost.currency;
  const m = cost.impliedMargin;
  if (m && !m.complete) {
    return <Figure label="Implied margin" value={<span className="text-graphite-600">Incomplete</span>} testId="cost-margin" sub={m.reason} />;
  }
  const loss = Boolean(m && m.amount !== null && m.amount < 0);
  return (
    <Figure
      label={loss ? 'Implied margin: a loss' : 'Implied margin'}
      loss={loss}
      value={m ? money(m.amount, cur) : '—'}
      testId="cost-margin"
      sub={
        cost.retail ? (
          <>
            {formatPercent(m?.fraction ?? null)} of {money(cost.retail.netToMaker, cur)} net, from retail {cost.retail.seen.amount.toFixed(2)} {cost.retail.seen.currency}
            {cost.retail.seen.currency !== cur ? ` (${money(cost.retail.amount, cur)})` : ''} {salesTaxText(cost.retail.salesTax)}
          </>
        ) : (
          'No retail price on the device'
        )
      }
    />
  );
}

function Summary({ cost }: { cost: CostRollUpDto }) {
  const cur = cost.currency;
  return (
    <div className="grid gap-3 sm:grid-cols-2 2xl:grid-cols-4">
      <Figure
        label="Parts with attrition"
        value={money(cost.partsTotal, cur)}
        testId="cost-parts-total"
        sub={`${cost.lines.length - cost.unpricedPartIds.length} of ${cost.lines.length} lines priced · ${ratesOf(cost.rateDate)}`}
      />
      <Figure
        label="Ex-works"
        value={money(cost.exWorks, cur)}
        testId="cost-ex-works"
        sub={`Assembly ${money(cost.assembly, cur)} · labour and test ${money(cost.labour, cur)} + ${money(cost.test, cur)}`}
      />
      <Figure
        label="Landed cost"
        strong
        value={money(cost.landed, cur)}
        testId="cost-landed"
        sub={
          <>
            Range {money(cost.low, cur)} – {money(cost.high, cur)} from price confidence
          </>
        }
      />
      <MarginFigure cost={cost} />
    </div>
  );
}

function VolumePicker({ cost, onVolume, error }: { cost: CostRollUpDto; onVolume: (v: number | undefined) => void; error: string | null }) {
  const [custom, setCustom] = useState('');
  return (
    <div>
      <div className="mb-1 text-xs font-medium text-graphite-600" id="volume-label">
        Volume
      </div>
      <div className="flex flex-wrap items-center gap-1" role="group" aria-labelledby="volume-label">
        {cost.model.volumes.map((v) => (
          <button
            key={v}
            type="button"
            aria-pressed={cost.volume === v}
            onClick={() => {
              setCustom('');
              onVolume(v);
            }}
            className={`num h-8 rounded-md px-2.5 text-sm font-medium ring-1 ring-inset ${cost.volume === v ? 'bg-graphite-900 text-white ring-graphite-900' : 'bg-white text-graphite-800 ring-graphite-200 hover:bg-graphite-50'}`}
          >
            {v.toLocaleString('en-GB')}
          </button>
        ))}
        <form
          className="flex items-center gap-1"
          onSubmit={(e) => {
            e.preventDefault();
            // The server checks the number (a whole number of at least 1) and names the field.
            if (custom.trim() !== '') onVolume(Number(custom));
          }}
        >
          <input
            aria-label="Other volume (units)"
            aria-invalid={Boolean(error)}
            inputMode="numeric"
            placeholder="Other"
            value={custom}
            onChange={(e) => setCustom(e.target.value)}
            className="num h-8 w-24 rounded-md border border-graphite-200 px-2 text-sm focus:border-copper-500 focus:outline-none aria-[invalid=true]:border-brick-600"
          />
          <Button size="sm" type="submit" variant="secondary">
            Cost it
          </Button>
        </form>
      </div>
      {error && (
        <p role="alert" className="mt-1 text-xs text-brick-700">
          {error}
        </p>
      )}
    </div>
  );
}

/** The teardown's should-cost: BOM with prices at a volume, charts, volume table, steps, model and rates. */
export function CostSection({ teardown }: { teardown: TeardownDto }) {
  const id = teardown.id;
  const canEdit = teardown.permissions.editPrices;
  const [volume, setVolume] = useState<number | undefined>(undefined);
  const [currency, setCurrency] = useState<string | undefined>(undefined);
  const [editing, setEditing] = useState<CostLine | null>(null);
  const [importing, setImporting] = useState(false);
  const cost = useCost(id, { volume, currency });
  const rates = useRates();
  const onEdit = useCallback((l: CostLine) => setEditing((e) => (e?.partId === l.partId ? null : l)), []);

  const queryError = cost.error instanceof ApiError && cost.error.status === 400 ? cost.error : null;
  const volumeError = queryError?.fields['query.volume'] ?? null;
  const currencyError = queryError?.fields.currency ?? queryError?.fields['query.currency'] ?? null;
  // A bad volume or currency keeps the last good answer on screen with the message beside the control.
  const lastGood = useRef<CostRollUpDto | undefined>(undefined);
  if (cost.data) lastGood.current = cost.data;
  const data = cost.data ?? (queryError ? lastGood.current : undefined);

  if (cost.isPending) return <Spinner label="Working out the cost…" />;
  if (!data) return <ErrorPanel error={cost.error} onRetry={() => cost.refetch()} />;

  const table = rates.data?.current;
  const currencies = table ? [table.base, ...Object.keys(table.rates)].sort() : [data.currency];
  const empty = data.lines.length === 0;

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end gap-x-6 gap-y-3">
        {!empty && <VolumePicker cost={data} onVolume={setVolume} error={volumeError} />}
        <div>
          <label htmlFor="cost-currency" className="mb-1 block text-xs font-medium text-graphite-600">
            Currency
          </label>
          <select
            id="cost-currency"
            value={currency ?? data.currency}
            onChange={(e) => setCurrency(e.target.value)}
            className="h-8 rounded-md border border-graphite-200 bg-white px-2 text-sm focus:border-copper-500 focus:outline-none"
          >
            {[...new Set([...currencies, data.currency])].sort().map((c) => (
              <option key={c}>{c}</option>
            ))}
          </select>
          {currencyError && <p className="mt-1 text-xs text-brick-700">{currencyError}</p>}
        </div>
        <div className="text-xs text-graphite-500" data-testid="rate-date">
          {data.rateTable ? (
            <>
              Rates of <strong className="text-graphite-700">{formatDate(data.rateTable.date)}</strong>
              <br />
              {data.rateTable.source}
            </>
          ) : (
            'No rate table yet'
          )}
        </div>
        <div className="ml-auto flex flex-wrap items-center gap-2">
          {cost.isFetching && (
            <span className="text-xs text-graphite-500" role="status">
              Recalculating…
            </span>
          )}
          {!empty && (
            <a
              href={costCsvUrl(id, { volume: data.volume, currency: data.currency })}
              download
              className="inline-flex h-9 items-center gap-2 rounded-md bg-white px-3.5 text-sm font-medium text-graphite-900 ring-1 ring-inset ring-graphite-200 hover:bg-graphite-50"
            >
              <Download className="size-4" aria-hidden /> Export CSV
            </a>
          )}
          {canEdit && !empty && (
            <Button onClick={() => setImporting((v) => !v)} aria-expanded={importing}>
              <FileUp className="size-4" aria-hidden /> Import prices
            </Button>
          )}
        </div>
      </div>

      {empty ? (
        <Card>
          <EmptyState
            icon={<Calculator className="size-8" aria-hidden />}
            message="No parts in this teardown's BOM yet. Once the parts are listed, price them here to see the should-cost at each volume."
          />
        </Card>
      ) : (
        <>
          {data.warnings.length > 0 && (
            <aside className="rounded-md border border-amber-100 bg-amber-50 px-3 py-2 text-sm text-amber-800" aria-label="Things to know about these figures">
              <ul className="space-y-0.5">
                {data.warnings.map((w) => (
                  <li key={w} className="flex gap-2">
                    <TriangleAlert className="mt-0.5 size-3.5 shrink-0" aria-hidden /> {w}
                  </li>
                ))}
              </ul>
            </aside>
          )}
          <Summary cost={data} />
          {importing && <PriceImport teardownId={id} onClose={() => setImporting(false)} />}
          {editing && <PriceEditor key={editing.partId} teardownId={id} line={editing} currencies={currencies} onClose={() => setEditing(null)} />}
          <CostBomTable cost={data} canEdit={canEdit} editingId={editing?.partId ?? null} onEdit={onEdit} />
          {!canEdit && data.priceView === 'detail' && <p className="text-xs text-graphite-500">Prices are set by sourcing; you see them read-only.</p>}
          <WidgetBoundary name="cost-charts">
            <Suspense fallback={<Spinner label="Drawing the charts…" />}>
              <CostCharts cost={data} />
            </Suspense>
          </WidgetBoundary>
          <VolumeTable cost={data} onPick={setVolume} />
          <div className="grid gap-4 xl:grid-cols-2">
            <CostSteps cost={data} />
            <div className="space-y-4">
              <RatesUsed cost={data} canEdit={canEdit} />
            </div>
          </div>
        </>
      )}
      <TeardownModelCard teardownId={id} canEdit={canEdit} />
    </div>
  );
}
