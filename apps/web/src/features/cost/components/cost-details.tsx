// The volume table, how the total adds up, and the rates the roll-up used.
import { useState } from 'react';
import { toast } from 'sonner';
import type { CostRollUpDto } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { Card } from '@/components/page';
import { ApiError } from '@/lib/api-client';
import { formatDate, formatPercent } from '@/lib/format';
import { useRates } from '../api/rates';
import { useSaveRates } from '../api/save-rates';
import { money, plain, ratesOf } from './display';

export function VolumeTable({ cost, onPick }: { cost: CostRollUpDto; onPick: (volume: number) => void }) {
  const cur = cost.currency;
  return (
    <Card title={`Cost at each volume (${cur} per unit, ${ratesOf(cost.rateDate)})`}>
      <div className="overflow-x-auto">
        <table className="w-full text-sm" aria-label="Cost at each volume">
          <thead className="bg-graphite-50 text-left text-xs uppercase tracking-wide text-graphite-600">
            <tr>
              <th className="px-3 py-1.5 font-semibold">Volume</th>
              <th className="px-3 py-1.5 text-right font-semibold">Parts</th>
              <th className="px-3 py-1.5 text-right font-semibold">Ex-works</th>
              <th className="px-3 py-1.5 text-right font-semibold">Landed</th>
              <th className="px-3 py-1.5 text-right font-semibold">Low – high</th>
              <th className="px-3 py-1.5 text-right font-semibold">Implied margin</th>
            </tr>
          </thead>
          <tbody>
            {cost.volumes.map((v) => {
              const current = v.volume === cost.volume;
              return (
                <tr key={v.volume} className={`border-t border-graphite-100 ${current ? 'bg-copper-50 font-medium' : 'hover:bg-graphite-50'}`} aria-current={current || undefined}>
                  <td className="px-3 py-1.5">
                    <button type="button" className="num text-copper-700 hover:underline disabled:text-graphite-950 disabled:no-underline" disabled={current} onClick={() => onPick(v.volume)}>
                      {v.volume.toLocaleString('en-GB')} units
                    </button>
                    {!cost.model.volumes.includes(v.volume) && <span className="ml-1 text-xs text-graphite-500">(chosen)</span>}
                  </td>
                  <td className="num px-3 py-1.5 text-right">{money(v.partsTotal, cur)}</td>
                  <td className="num px-3 py-1.5 text-right">{money(v.exWorks, cur)}</td>
                  <td className="num px-3 py-1.5 text-right">{money(v.landed, cur)}</td>
                  <td className="num px-3 py-1.5 text-right text-graphite-600">
                    {money(v.low, cur)} – {money(v.high, cur)}
                  </td>
                  <td className="num px-3 py-1.5 text-right">
                    {v.impliedMargin && !v.impliedMargin.complete ? (
                      <span className="text-graphite-600" title={v.impliedMargin.reason ?? undefined}>
                        incomplete{' '}
                        <span className="text-xs text-graphite-600">
                          ({v.impliedMargin.pricedLines} of {v.impliedMargin.totalLines} lines priced)
                        </span>
                      </span>
                    ) : v.impliedMargin ? (
                      <>
                        {money(v.impliedMargin.amount, cur)} <span className="text-xs text-graphite-600">({formatPercent(v.impliedMargin.fraction)})</span>
                      </>
                    ) : (
                      '—'
                    )}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
    </Card>
  );
}

/** Each step of the roll-up with its formula and inputs (what a figure is made of). */
export function CostSteps({ cost }: { cost: CostRollUpDto }) {
  const cur = cost.currency;
  return (
    <Card title="How the total adds up">
      <ol className="divide-y divide-graphite-100">
        {cost.steps.map((s) => (
          <li key={s.key}>
            <details className="group px-4 py-2">
              <summary className="flex cursor-pointer list-none items-baseline justify-between gap-3 text-sm">
                <span className={['exWorks', 'landed', 'impliedMargin'].includes(s.key) ? 'font-semibold' : ''}>{s.label}</span>
                <span className="num font-medium">{money(s.value, cur)}</span>
              </summary>
              <div className="mt-1.5 space-y-1 text-xs text-graphite-600">
                <p className="font-mono">{s.formula}</p>
                <ul className="flex flex-wrap gap-x-4 gap-y-0.5">
                  {s.inputs.map((i) => (
                    <li key={i.label}>
                      {i.label}:{' '}
                      <span className="num text-graphite-900">
                        {typeof i.value === 'number'
                          ? i.unit && i.unit.length === 3
                            ? money(i.value, i.unit)
                            : `${plain(Number(i.value.toPrecision(4)))}${i.unit ? ` ${i.unit}` : ''}`
                          : String(i.value)}
                      </span>
                    </li>
                  ))}
                </ul>
              </div>
            </details>
          </li>
        ))}
      </ol>
      <p className="border-t border-graphite-100 px-4 py-2 text-xs text-graphite-500">
        Figures are engineering estimates for judgement, not quotations. Money converted at the {ratesOf(cost.rateDate)}
        {cost.rateTable ? ` (${cost.rateTable.source}, base ${cost.rateTable.base})` : ''}.
      </p>
    </Card>
  );
}

/** The rates of the currencies this teardown uses; price editors can change one and see the totals move. */
export function RatesUsed({ cost, canEdit }: { cost: CostRollUpDto; canEdit: boolean }) {
  const rates = useRates();
  const save = useSaveRates();
  const [editing, setEditing] = useState<string | null>(null);
  const [value, setValue] = useState('');
  const [error, setError] = useState<string | null>(null);
  const table = rates.data?.current;
  const base = cost.rateTable?.base ?? table?.base;

  const submit = async (code: string) => {
    if (!table) return;
    setError(null);
    try {
      const r = await save.mutateAsync({
        base: table.base,
        date: new Date().toISOString().slice(0, 10),
        source: `Adjusted by hand from ${table.source}`.slice(0, 200),
        rates: { ...table.rates, [code]: value.trim() === '' ? Number.NaN : Number(value.replace(',', '.')) },
      });
      toast.success(`${code} rate saved as a new rate table; totals updated.`);
      r.warnings.forEach((w) => toast.warning(w));
      setEditing(null);
    } catch (err) {
      setError(err instanceof ApiError ? (Object.values(err.fields)[0] ?? err.message) : 'The rate could not be saved.');
    }
  };

  return (
    <Card title="Rates used">
      <div className="p-4 text-sm">
        {cost.rateTable ? (
          <p className="mb-2 text-xs text-graphite-500">
            Rate table of <strong className="text-graphite-800">{formatDate(cost.rateTable.date)}</strong> · {cost.rateTable.source} · base {cost.rateTable.base}
          </p>
        ) : (
          <p className="mb-2 text-xs text-graphite-500">No rate table yet: everything is in {cost.currency}.</p>
        )}
        {cost.ratesUsed.length === 0 ? (
          <p className="text-graphite-600">Every amount is already in {cost.currency}; nothing was converted.</p>
        ) : (
          <table className="w-full" aria-label="Rates used">
            <thead className="text-left text-xs uppercase tracking-wide text-graphite-500">
              <tr>
                <th className="pb-1 font-semibold">Currency</th>
                <th className="pb-1 text-right font-semibold">Per 1 {base}</th>
                <th className="pb-1 text-right font-semibold">1 unit in {cost.currency}</th>
                {canEdit && <th className="w-16" />}
              </tr>
            </thead>
            <tbody>
              {cost.ratesUsed.map((r) => (
                <tr key={r.currency} className="border-t border-graphite-100 align-top">
                  <td className="py-1 font-mono">{r.currency}</td>
                  <td className="num py-1 text-right">
                    {editing === r.currency ? (
                      <form
                        className="flex justify-end gap-1"
                        onSubmit={(e) => {
                          e.preventDefault();
                          void submit(r.currency);
                        }}
                      >
                        <input
                          aria-label={`Rate of ${r.currency} per 1 ${base}`}
                          autoFocus
                          inputMode="decimal"
                          value={value}
                          onChange={(e) => setValue(e.target.value)}
                          className="num h-7 w-24 rounded border border-graphite-200 px-2 text-right text-sm focus:border-copper-500 focus:outline-none"
                        />
                        <Button size="sm" type="submit" variant="primary" busy={save.isPending}>
                          Save
                        </Button>
                      </form>
                    ) : (
                      plain(r.perBase)
                    )}
                  </td>
                  <td className="num py-1 text-right">{money(r.toReporting, cost.currency)}</td>
                  {canEdit && (
                    <td className="py-1 text-right">
                      {editing === r.currency ? (
                        <Button size="sm" variant="ghost" onClick={() => setEditing(null)}>
                          Cancel
                        </Button>
                      ) : (
                        <Button
                          size="sm"
                          variant="quiet"
                          disabled={!table || r.currency === base}
                          onClick={() => {
                            setEditing(r.currency);
                            setValue(plain(r.perBase));
                            setError(null);
                          }}
                        >
                          Change
                        </Button>
                      )}
                    </td>
                  )}
                </tr>
              ))}
            </tbody>
          </table>
        )}
        {error && (
          <p role="alert" className="mt-2 text-xs text-brick-700">
            {error}
          </p>
        )}
        {canEdit && cost.ratesUsed.length > 0 && <p className="mt-2 text-xs text-graphite-500">Changing a rate saves a new rate table for the whole workspace; the history keeps the old one.</p>}
      </div>
    </Card>
  );
}
