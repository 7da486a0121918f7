import type { FigureDto, FiguresResponse } from '@splitcase/contracts';
import { EstimatesNote, HotSurfaceNote } from '@/components/safety';
import { figureInputValue, figureValue, groupFigures } from '@/lib/figure-values';
import { NoneRecorded, ReportSubheading, ReportTable } from './report-layout';

/** The per-mode figures a reader compares across modes, in the order of the summary's columns. */
const MODE_SUMMARY: { key: string; head: string }[] = [
  { key: 'mode.power', head: 'At the loads' },
  { key: 'mode.packPower', head: 'From the pack' },
  { key: 'mode.current', head: 'Pack current' },
  { key: 'mode.cRate', head: 'C-rate' },
  { key: 'mode.runtime.hours', head: 'Runtime' },
  { key: 'mode.surfaceTemperature', head: 'Surface' },
  { key: 'mode.touchMargin', head: 'Touch margin' },
  { key: 'mode.standby.months', head: 'Standby' },
];
const SUMMARY_ORDER = new Map(MODE_SUMMARY.map((c, k) => [c.key, k]));

/** A mode's figures: the summary's figures first, in its order, then the rest as the server sent them. */
const inModeOrder = (figures: FigureDto[]) =>
  figures
    .map((f, k) => ({ f, k }))
    .sort((a, b) => (SUMMARY_ORDER.get(a.f.key) ?? 100 + a.k) - (SUMMARY_ORDER.get(b.f.key) ?? 100 + b.k))
    .map(({ f }) => f);

/** A figure outside what the physics or the chemistry allows, said in words (never by colour alone). */
function Implausible() {
  return (
    <span className="ml-1 whitespace-nowrap rounded-sm border border-brick-600 px-1 text-2xs font-semibold uppercase tracking-wide text-brick-700" data-testid="figure-implausible">
      implausible
    </span>
  );
}

/** A surface temperature read at the bench, rather than estimated (its input `measuredSurfaceC`). */
const measured = (f: FigureDto) => f.inputs.some((i) => i.key === 'measuredSurfaceC' && i.value !== null);

/** Cautions of a set of figures, once each, unless a warning already says it. */
function cautionsOf(figures: FigureDto[]): string[] {
  const said = figures.flatMap((f) => f.warnings).join(' ');
  return [...new Set(figures.map((f) => f.caution).filter((c): c is string => Boolean(c) && !said.includes(c!)))];
}

/** Figures with their value, formula, inputs and source, one row each. */
function FigureTable({ label, figures }: { label: string; figures: FigureDto[] }) {
  return (
    <>
      <ReportTable label={label} head={['Figure', 'Value', 'Formula and inputs', 'Source']}>
        {figures.map((f) => (
          <tr key={`${f.modeId ?? 'device'}-${f.key}`} data-figure={f.key} data-mode={f.modeId ?? ''} data-implausible={f.implausible ? 'true' : 'false'}>
            <td className="w-[24%] text-graphite-950">{f.label}</td>
            <td className="num w-[13%] font-semibold text-graphite-950">
              <span className="whitespace-nowrap">{figureValue(f.value, f.unit)}</span>
              {f.implausible && <Implausible />}
            </td>
            <td className="w-[38%]">
              <p className="font-mono text-2xs text-graphite-900">{f.formula}</p>
              {f.inputs.length > 0 && (
                <p className="mt-0.5 text-2xs text-graphite-600">
                  {f.inputs.map((i, n) => (
                    <span key={`${i.key}-${n}`}>
                      {n > 0 && '; '}
                      {i.label} <span className="num text-graphite-900">{figureInputValue(i)}</span>
                    </span>
                  ))}
                </p>
              )}
              {f.assumptions.length > 0 && <p className="mt-0.5 text-2xs text-graphite-500">Assumes: {f.assumptions.join(' ')}</p>}
              {f.warnings.length > 0 && <p className="mt-0.5 text-2xs text-amber-800">Warning: {f.warnings.join(' ')}</p>}
            </td>
            <td className="w-[25%] text-2xs text-graphite-600" data-testid="figure-source">
              {f.source}
            </td>
          </tr>
        ))}
      </ReportTable>
      {cautionsOf(figures).map((c) => (
        <div key={c} className="mt-1.5 break-inside-avoid">
          <HotSurfaceNote text={c} />
        </div>
      ))}
    </>
  );
}

/** One row per mode, one column per figure compared across modes; the tables after it give each figure's formula and source. */
function ModeSummary({ modes, figures }: { modes: FiguresResponse['modes']; figures: FigureDto[] }) {
  const cell = (modeId: number, key: string) => {
    const f = figures.find((x) => x.modeId === modeId && x.key === key);
    if (!f) return <span className="text-graphite-500">—</span>;
    return (
      <>
        <span className="whitespace-nowrap">{figureValue(f.value, f.unit)}</span>
        {key === 'mode.surfaceTemperature' && <span className="block text-2xs font-normal text-graphite-500">{measured(f) ? 'measured' : 'estimate'}</span>}
        {f.implausible && <Implausible />}
      </>
    );
  };
  return (
    <ReportTable label="Figures by mode" keep head={['Mode', ...MODE_SUMMARY.map((c) => c.head)]}>
      {modes.map((m) => (
        <tr key={m.id} data-mode-row={m.id}>
          <td className="font-medium text-graphite-950">{m.name}</td>
          {MODE_SUMMARY.map((c) => (
            <td key={c.key} className="num" data-summary={c.key}>
              {cell(m.id, c.key)}
            </td>
          ))}
        </tr>
      ))}
    </ReportTable>
  );
}

/**
 * Every derived figure with its value, formula, inputs and source: with operating modes recorded,
 * a summary across modes and a table per mode, then the whole-device figures grouped as on the
 * figures panel. Implausible figures are marked in words.
 */
export function ReportFigures({ data }: { data: FiguresResponse }) {
  if (!data.figures.length) return <NoneRecorded>No figures yet: they follow from the pack, loads and converters once recorded.</NoneRecorded>;
  const device = data.figures.filter((f) => f.modeId === null);
  const known = new Set(data.modes.map((m) => m.id));
  // A per-mode figure whose mode is not listed (it should not happen) still prints, under its id.
  const modes = [...data.modes, ...[...new Set(data.figures.map((f) => f.modeId).filter((id): id is number => id !== null && !known.has(id)))].map((id) => ({ id, name: `Mode #${id}`, note: null }))];
  const implausible = data.figures.filter((f) => f.implausible).length;
  return (
    <div>
      {/*
        The notes stay with what follows, never alone at a page's foot: with modes, the summary across
        modes (kept whole); without, about 25 mm of the first table (the padding counts, the negative
        margin gives it back).
      */}
      <div className={modes.length ? 'break-inside-avoid' : '-mb-[25mm] break-inside-avoid pb-[25mm]'}>
        <EstimatesNote text={data.note} />
        {implausible > 0 && (
          <p className="mt-1.5 text-xs text-brick-700" data-testid="implausible-count">
            {implausible === 1 ? 'One figure is' : `${implausible} figures are`} marked implausible: outside what the physics or the chemistry allows. Check the inputs (a unit typed wrong is the usual
            cause) before relying on {implausible === 1 ? 'it' : 'them'}.
          </p>
        )}
        {modes.length === 0 && (
          <p className="mt-2 text-xs text-graphite-600" data-testid="no-modes">
            No operating modes recorded: the figures below take all loads at once. Record the modes in the power system for runtimes per mode.
          </p>
        )}
        {modes.length > 0 && (
          <>
            <ReportSubheading>Figures by operating mode</ReportSubheading>
            <ModeSummary modes={modes} figures={data.figures} />
          </>
        )}
      </div>
      {modes.length > 0 && (
        <>
          {modes.map((m) => {
            const own = inModeOrder(data.figures.filter((f) => f.modeId === m.id));
            return (
              <div key={m.id} data-mode-figures={m.id}>
                <ReportSubheading>
                  Mode: {m.name}
                  {m.note ? <span className="font-normal normal-case tracking-normal"> ({m.note})</span> : null}
                </ReportSubheading>
                {own.length ? (
                  <FigureTable label={`Figures of mode ${m.name}`} figures={own} />
                ) : (
                  <NoneRecorded>No figures for this mode: it runs no load with a power recorded and has no quiescent current.</NoneRecorded>
                )}
              </div>
            );
          })}
        </>
      )}
      {groupFigures(device).map((g) => (
        <div key={g.title}>
          <ReportSubheading>{modes.length > 0 ? `Whole device: ${g.title.toLowerCase()}` : g.title}</ReportSubheading>
          <FigureTable label={`${g.title} figures`} figures={g.figures} />
        </div>
      ))}
    </div>
  );
}
