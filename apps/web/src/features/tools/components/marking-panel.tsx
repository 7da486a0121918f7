import { useState } from 'react';
import { Check } from 'lucide-react';
import { BAND_COLOURS, MARKING_KIND_LABELS, MARKING_KINDS, type MarkingKindInput, type MarkingReadingDto, type MarkingToolBody } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { Field, Select, InlineError } from '@/components/field';
import { Badge } from '@/components/badges';
import { formatQuantity } from '@/lib/format';
import { useDebouncedValue } from '@/lib/use-debounced-value';
import { useMarking } from '../api/decode-marking';
import { HowComputed, Warnings } from './figure-card';
import { QuantityField } from './quantity-field';
import { Segmented } from './segmented';
import { ResultsState, ToolLayout } from './tool-layout';
import { useToolResult } from './use-tool-result';

type Mode = 'code' | 'bands';
const BAND_COUNTS = ['3', '4', '5', '6'] as const;
type BandCount = (typeof BAND_COUNTS)[number];

/** What each band position means, for the select labels. */
function bandRole(index: number, count: number): string {
  const digits = count >= 5 ? 3 : 2;
  if (index < digits) return `digit ${index + 1}`;
  if (index === digits) return 'multiplier';
  if (index === digits + 1) return 'tolerance';
  return 'temperature coefficient';
}

const capitalise = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

function percent(value: number): string {
  const sign = value > 0 ? '+' : value < 0 ? '−' : '±';
  return `${sign}${Math.abs(value).toFixed(2)} %`;
}

function PreferredTable({ reading }: { reading: MarkingReadingDto }) {
  const unit = reading.unit;
  return (
    <table className="mt-1 w-full text-sm">
      <thead>
        <tr className="text-left text-xs text-graphite-500">
          <th scope="col" className="py-1 pr-2 font-medium">
            Series
          </th>
          <th scope="col" className="py-1 pr-2 font-medium">
            Meant for
          </th>
          <th scope="col" className="py-1 pr-2 text-right font-medium">
            Nearest
          </th>
          <th scope="col" className="py-1 pr-2 text-right font-medium">
            Off by
          </th>
          <th scope="col" className="py-1 font-medium">
            <span className="sr-only">In the series</span>
          </th>
        </tr>
      </thead>
      <tbody>
        {reading.preferred.map((p) => (
          <tr key={p.series} className="h-8 border-t border-graphite-100">
            <td className="pr-2 font-mono">{p.series}</td>
            <td className="num pr-2 text-graphite-600">±{p.tolerancePercent} %</td>
            <td className="num pr-2 text-right font-medium">{formatQuantity(p.nearest, unit)}</td>
            <td className="num pr-2 text-right text-graphite-600">{p.member ? '—' : percent(p.deviationPercent)}</td>
            <td>
              {p.member && (
                <Badge tone="cell" icon={Check}>
                  in series
                </Badge>
              )}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

const SUBHEAD = 'text-xs font-medium uppercase tracking-wider text-graphite-500';

/**
 * One reading of a marking; `wide` puts the preferred values beside the reading. `of` is how many
 * readings the code has on this kind of part: with more than one, the card says which it is.
 */
function Reading({ reading, wide, of }: { reading: MarkingReadingDto; wide: boolean; of: number }) {
  const unit = reading.unit;
  const component = capitalise(reading.component);
  return (
    <article
      className="rounded-lg border border-graphite-150 bg-white px-4 pb-2 pt-3 shadow-card"
      aria-label={of > 1 ? `${component} reading ${reading.rank} of ${of}` : `${component} reading`}
      data-testid="marking-reading"
    >
      <div className={wide ? 'grid gap-x-8 xl:grid-cols-2' : ''}>
        <div>
          {of > 1 && (
            <div className="mb-1.5">
              <Badge tone={reading.rank === 1 ? 'cell' : 'neutral'} icon={reading.rank === 1 ? Check : undefined}>
                {reading.rank === 1 ? `Reading 1 of ${of} · most likely` : `Reading ${reading.rank} of ${of}`}
              </Badge>
            </div>
          )}
          <div className="flex flex-wrap items-center gap-2 text-sm text-graphite-600">
            <span>{component}</span>
            <span aria-hidden>·</span>
            <span data-testid="marking-rule">{reading.schemeLabel}</span>
          </div>
          <div className="mt-0.5 flex flex-wrap items-baseline gap-x-3 gap-y-1">
            <span className="num text-3xl font-semibold tracking-tight text-cell-700" data-testid="marking-value">
              {formatQuantity(reading.value, unit)}
            </span>
            {reading.tolerance && (
              <span className="num text-lg text-graphite-700">
                {reading.tolerance.text}
                {reading.tolerance.letter && <span className="ml-1 font-mono text-sm text-graphite-500">({reading.tolerance.letter})</span>}
              </span>
            )}
            {reading.temperatureCoefficientPpmPerK !== null && <span className="text-sm text-graphite-600">{reading.temperatureCoefficientPpmPerK} ppm/K</span>}
          </div>
          {reading.range && (
            <p className="num mt-1 text-sm text-graphite-600">
              Between {formatQuantity(reading.range.low, unit, 4)} and {formatQuantity(reading.range.high, unit, 4)}
            </p>
          )}
          <Warnings warnings={reading.warnings} />
          <h3 className={`mt-4 ${SUBHEAD}`}>What the code says</h3>
          <ol className="mt-1 list-decimal space-y-0.5 pl-5 text-sm text-graphite-800">
            {reading.meaning.map((m) => (
              <li key={m}>{m}</li>
            ))}
          </ol>
        </div>
        {reading.preferred.length > 0 && (
          <div>
            <h3 className={`mt-4 ${wide ? 'xl:mt-1' : ''} ${SUBHEAD}`}>Nearest preferred values (IEC 60063)</h3>
            <PreferredTable reading={reading} />
          </div>
        )}
      </div>
      <HowComputed formula={reading.formula} source={reading.source} inputs={reading.inputs} assumptions={reading.assumptions} />
    </article>
  );
}

/** Marking decoder: a printed code (resistor, capacitor or either) or colour bands. */
export function MarkingPanel() {
  const [mode, setMode] = useState<Mode>('code');
  const [code, setCode] = useState('');
  const [kind, setKind] = useState<MarkingKindInput>('auto');
  const [count, setCount] = useState<BandCount>('4');
  const [bands, setBands] = useState<string[]>(['', '', '', '', '', '']);

  const n = Number(count);
  const chosen = bands.slice(0, n);
  let body: MarkingToolBody | null = null;
  if (mode === 'code' && code.trim() !== '') body = { code: code.trim(), kind };
  if (mode === 'bands' && chosen.every((b) => b !== '')) body = { bands: chosen };
  const debounced = useDebouncedValue(body, 350);
  const query = useMarking(debounced);
  const state = useToolResult(query, debounced !== null);
  const bandError = state.fieldErrors.bands ?? Object.entries(state.fieldErrors).find(([k]) => k.startsWith('bands.'))?.[1];

  return (
    <ToolLayout
      title="Marking"
      actions={
        <Button
          size="sm"
          variant="quiet"
          onClick={() => {
            setMode('code');
            setCode('4R7');
            setKind('auto');
          }}
        >
          Example
        </Button>
      }
      inputs={
        <>
          <Segmented
            legend="Read from"
            value={mode}
            onChange={setMode}
            options={[
              { value: 'code', label: 'Printed code' },
              { value: 'bands', label: 'Colour bands' },
            ]}
          />
          {mode === 'code' ? (
            <>
              <QuantityField
                label="Marking as read"
                name="code"
                value={code}
                onChange={setCode}
                placeholder="472, 4R7, 68X, 104K, 4n7"
                hint="3- or 4-digit codes, R/K/M or p/n/u as the decimal point, EIA-96, a tolerance letter. A code that reads more than one way shows every reading, most likely first."
                error={state.fieldErrors.code}
                mono
              />
              <Segmented legend="Part" value={kind} onChange={setKind} options={MARKING_KINDS.map((k) => ({ value: k, label: MARKING_KIND_LABELS[k] }))} />
            </>
          ) : (
            <>
              <Segmented legend="Number of bands" value={count} onChange={setCount} options={BAND_COUNTS.map((c) => ({ value: c, label: c }))} />
              <div className="grid grid-cols-2 gap-3">
                {chosen.map((b, i) => (
                  <Field key={i} label={`Band ${i + 1} · ${bandRole(i, n)}`} error={state.fieldErrors[`bands.${i}`]}>
                    {(props) => (
                      <Select {...props} value={b} className="h-11 text-base" onChange={(e) => setBands((all) => all.map((x, j) => (j === i ? e.target.value : x)))}>
                        <option value="">Choose…</option>
                        {BAND_COLOURS.map((c) => (
                          <option key={c} value={c}>
                            {capitalise(c)}
                          </option>
                        ))}
                      </Select>
                    )}
                  </Field>
                ))}
              </div>
              <p className="text-xs text-graphite-500">Read from the end away from the tolerance band (often gold or silver, set apart).</p>
              <InlineError message={bandError} />
            </>
          )}
        </>
      }
    >
      <ResultsState
        empty={mode === 'code' ? 'Type the marking as printed on the part; units and letters as they appear.' : 'Choose a colour for every band.'}
        hasResult={state.result !== undefined}
        outdated={state.outdated}
        busy={state.busy}
        message={state.message}
      >
        {state.result && (
          <div className="space-y-4">
            {state.result.note && <p className="rounded-md bg-graphite-100 px-3 py-2 text-sm text-graphite-700">{state.result.note}</p>}
            {/* Every valid reading, ranked on each kind of part: resistor readings first. */}
            <div className={`grid gap-4 ${state.result.readings.length > 1 ? 'xl:grid-cols-2' : ''}`}>
              {state.result.readings.map((r) => (
                <Reading key={`${r.component}-${r.rank}`} reading={r} wide={state.result!.readings.length === 1} of={state.result!.readings.filter((x) => x.component === r.component).length} />
              ))}
            </div>
          </div>
        )}
      </ResultsState>
    </ToolLayout>
  );
}
