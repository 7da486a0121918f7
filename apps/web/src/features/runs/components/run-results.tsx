import type { ReactNode } from 'react';
import { CircleCheck, TriangleAlert } from 'lucide-react';
import { SURFACE_MATERIAL, type RunDto } from '@splitcase/contracts';
import { Badge } from '@/components/badges';
import { Caution } from '@/components/caution';
import { formatQuantity, sig } from '@/lib/format';
import { formatElapsed } from './time-format';

/** One figure: what it is, its value with a unit, and where it comes from. */
function Figure({ label, value, detail, tone = 'plain' }: { label: string; value: ReactNode; detail?: ReactNode; tone?: 'plain' | 'energy' }) {
  return (
    <div className="rounded-md border border-graphite-100 bg-graphite-50/50 px-3 py-2">
      <dt className="text-xs font-medium text-graphite-500">{label}</dt>
      <dd className={`num mt-0.5 text-lg font-semibold ${tone === 'energy' ? 'text-cell-700' : 'text-graphite-950'}`}>{value}</dd>
      {detail && <dd className="mt-0.5 text-xs text-graphite-500">{detail}</dd>}
    </div>
  );
}

type Discharge = NonNullable<RunDto['analysis']['discharge']>;
type Charge = NonNullable<RunDto['analysis']['charge']>;

/** The debounce a discharge's cut-off used, in words. */
const debounceText = (d: NonNullable<Discharge['cutoffDebounce']>) =>
  d.seconds > 0 ? `held ${formatElapsed(d.seconds)} (${d.source === 'run' ? 'this run' : 'workspace setting'})` : `no debounce (${d.source === 'run' ? 'this run' : 'workspace setting'})`;

/** What the termination fraction was taken of: C of the rated capacity, or (older runs, no pack record) the CC current. */
const terminationText = (c: Charge) =>
  c.termination?.basis === 'rated-capacity' && c.termination.ratedAh !== null
    ? `${Number(c.terminationFraction.toPrecision(3))} C of ${formatQuantity(c.termination.ratedAh, 'Ah')} rated`
    : `${sig(c.terminationFraction * 100, 2)} % of CC`;

const celsius = (c: number | null | undefined, digits = 3) => (c === null || c === undefined ? '—' : `${sig(c, digits)} °C`);
const percent = (p: number) => `${sig(p, 3)} %`;

function Verdict({ warning, warnBelow, children }: { warning: boolean; warnBelow: number; children: ReactNode }) {
  return (
    <div className="flex flex-wrap items-center gap-2 text-sm">
      {warning ? (
        <Badge tone="amber" icon={TriangleAlert} title={`Below the ${warnBelow} % warning threshold`}>
          Below {sig(warnBelow, 3)} %
        </Badge>
      ) : (
        <Badge tone="cell" icon={CircleCheck}>
          At or above {sig(warnBelow, 3)} %
        </Badge>
      )}
      <span className="text-graphite-700">{children}</span>
    </div>
  );
}

/** Measured against the label and the cell rating, with the workspace threshold. */
export function RunComparison({ run }: { run: RunDto }) {
  const c = run.comparison;
  if (!c.label && !c.rated && !c.labelEnergy) {
    if (run.kind !== 'discharge' && run.kind !== 'power-bank') return null;
    return <p className="text-sm text-graphite-500">The device record states no capacity to compare with.</p>;
  }
  return (
    <section aria-label="Comparison with the label" className="space-y-2 rounded-md border border-graphite-100 p-3">
      <h3 className="text-xs font-semibold uppercase tracking-wide text-graphite-500">Measured against the claims</h3>
      {c.label && (
        <div className="space-y-0.5">
          <Verdict warning={c.label.warning} warnBelow={c.warnBelowPercent}>
            <strong className="num">{percent(c.label.percent)}</strong> of the label, in energy: {formatQuantity(c.label.measuredWh, 'Wh')} delivered, {formatQuantity(c.label.claimedWh, 'Wh')} claimed
            {c.label.claimedAh !== null && <> ({formatQuantity(c.label.claimedAh, 'Ah')} on the label)</>}.
          </Verdict>
          <p className="text-xs text-graphite-500">Basis: {c.label.basis}</p>
        </div>
      )}
      {c.rated && (
        <Verdict warning={c.rated.warning} warnBelow={c.warnBelowPercent}>
          <strong className="num">{percent(c.rated.percent)}</strong> of the cell rating: {formatQuantity(c.rated.ratedAh, 'Ah')} from {c.rated.basis}.
        </Verdict>
      )}
      {c.labelEnergy && (
        <div className="flex flex-wrap items-center gap-2 text-sm">
          {c.labelEnergy.warning ? (
            <Badge tone="amber" icon={TriangleAlert}>
              Below 80 % of the label energy
            </Badge>
          ) : (
            <Badge tone="cell" icon={CircleCheck}>
              At or above 80 % of the label energy
            </Badge>
          )}
          <span className="text-graphite-700">
            <strong className="num">{percent(c.labelEnergy.percent)}</strong>: {formatQuantity(c.labelEnergy.measuredWh, 'Wh')} at the output against {formatQuantity(c.labelEnergy.claimedWh, 'Wh')} on
            the label. Conversion usually keeps 80–90 % of the cell energy.
          </span>
          <p className="w-full text-xs text-graphite-500">Basis: {c.labelEnergy.basis}</p>
        </div>
      )}
      {(c.label || c.rated) && <p className="text-xs text-graphite-500">Warning threshold: {sig(c.warnBelowPercent, 3)} % of the claimed capacity (workspace setting).</p>}
    </section>
  );
}

/** Hot-surface caution next to thermal results: specific to this run's peak and threshold. */
function HotSurface({ run }: { run: RunDto }) {
  const th = run.analysis.thermal!;
  const b = th.burnThreshold;
  const material = SURFACE_MATERIAL.labels[b.material].toLowerCase();
  const contact = formatElapsed(b.contactSeconds);
  if (th.marginC < 5) {
    return (
      <Caution title={th.marginC < 0 ? 'Hot enough to burn' : 'Close to the burn threshold'}>
        The surface peaked at {celsius(th.maxC)}, {th.marginC < 0 ? `${sig(-th.marginC, 2)} °C above` : `only ${sig(th.marginC, 2)} °C below`} the {b.temperatureC} °C burn threshold for {contact} of
        contact with {material}
        {th.timeToBurnThresholdS !== null && `, reached after ${formatElapsed(th.timeToBurnThresholdS)}`}. Check it with the thermocouple rather than a finger, let the device cool before handling it,
        and follow your lab&apos;s safety rules. These are bench estimates, not certification results.
      </Caution>
    );
  }
  return (
    <p className="text-xs text-graphite-500">
      The peak stays {sig(th.marginC, 2)} °C under the {b.temperatureC} °C burn threshold for {contact} of contact with {material}. A longer contact lowers the threshold (43 °C from 8 h).
    </p>
  );
}

/** The figures of a run, by kind, with notes and warnings from the analysis. */
export function RunResults({ run }: { run: RunDto }) {
  const a = run.analysis;
  let figures: ReactNode = null;
  if (run.kind === 'discharge' && a.discharge) {
    const d = a.discharge;
    const cutoff =
      d.cutoff?.reason === 'cutoff-voltage'
        ? `${formatQuantity(d.cutoffVolts, 'V')} reached after ${formatElapsed(d.cutoff.t)}`
        : d.cutoff?.reason === 'current-stopped'
          ? `load stopped after ${formatElapsed(d.cutoff.t)}`
          : d.cutoffVolts
            ? `${formatQuantity(d.cutoffVolts, 'V')} not reached`
            : 'end of the log';
    const debounce = d.cutoffVolts !== null && d.cutoffDebounce ? debounceText(d.cutoffDebounce) : null;
    const ignored = d.ignoredDips ? `; ${d.ignoredDips.count === 1 ? 'one sag' : `${d.ignoredDips.count} sags`} below it ignored (longest ${formatElapsed(d.ignoredDips.longestS)})` : '';
    const r = d.internalResistance;
    figures = (
      <>
        <Figure label="Delivered capacity" value={formatQuantity(a.ampHours, 'Ah')} detail="Trapezoidal ∫I dt to the cut-off" tone="energy" />
        <Figure label="Delivered energy" value={formatQuantity(a.wattHours, 'Wh')} detail="∫V·I dt, per sample" tone="energy" />
        <Figure label="Duration" value={formatElapsed(a.durationS)} detail={`Cut-off: ${cutoff}${debounce ? `; ${debounce}` : ''}${ignored}`} />
        <Figure label="Average voltage" value={formatQuantity(a.averageVolts, 'V')} detail={`Wh ÷ Ah; time-weighted ${formatQuantity(d.timeAverageVolts, 'V')}`} />
        <Figure label="End voltage" value={formatQuantity(a.endVolts, 'V')} detail={`Lowest ${formatQuantity(d.minVolts, 'V')}`} />
        <Figure label="Average load" value={formatQuantity(d.averageCurrentA, 'A')} detail={formatQuantity(d.averagePowerW, 'W')} />
        {d.meanSquareVolts !== undefined && (
          <Figure
            label="Mean V²"
            value={`${sig(d.meanSquareVolts, 4)} V²`}
            detail={`RMS ${formatQuantity(Math.sqrt(d.meanSquareVolts), 'V', 4)}; a fixed resistance R takes mean(V²) ÷ R on average, not (mean V)² ÷ R`}
          />
        )}
        {r !== undefined && (
          <Figure
            label="Internal resistance (DC)"
            value={r ? formatQuantity(r.ohms, 'Ω') : 'no pulse in the log'}
            detail={
              r ? (
                <>
                  {formatQuantity(r.lowAmps, 'A')} at {formatQuantity(r.lowVolts, 'V', 4)} → {formatQuantity(r.highAmps, 'A')} at {formatQuantity(r.highVolts, 'V', 4)}, after{' '}
                  {formatElapsed(r.atSeconds)}; (U₁ − U₂) ÷ (I₂ − I₁) at the pack terminals
                </>
              ) : (
                'Step the load between two steady currents (e.g. 0.2 C, then 1 C for 1 s) to measure it'
              )
            }
          />
        )}
      </>
    );
  } else if (run.kind === 'charge' && a.charge) {
    const c = a.charge;
    figures = (
      <>
        <Figure label="Charge taken in" value={formatQuantity(a.ampHours, 'Ah')} detail={formatQuantity(a.wattHours, 'Wh')} tone="energy" />
        <Figure
          label="Charge time"
          value={formatElapsed(c.chargeTimeS)}
          detail={c.terminated ? `To ${formatQuantity(c.terminationCurrentA, 'A')} (${terminationText(c)})` : 'Not terminated in the log'}
        />
        <Figure label="Constant current" value={formatQuantity(c.cc.currentA, 'A')} detail={`${formatElapsed(c.cc.endS - c.cc.startS)}, until ${formatElapsed(c.cc.endS)}`} />
        <Figure
          label="Constant voltage"
          value={c.cv ? formatQuantity(c.cv.volts, 'V') : 'none found'}
          detail={c.cv ? `${formatElapsed(c.cv.endS - c.cv.startS)}, from ${formatElapsed(c.cv.startS)}` : `Plateau ${formatQuantity(c.plateauVolts, 'V')}`}
        />
        <Figure
          label="Termination current"
          value={formatQuantity(c.terminationCurrentA, 'A')}
          detail={`${c.terminated ? 'Reached' : 'Not reached'}; ${c.termination?.description ?? `${sig(c.terminationFraction * 100, 2)} % of the constant current`}`}
        />
        <Figure label="Average voltage" value={formatQuantity(a.averageVolts, 'V')} detail={`End ${formatQuantity(a.endVolts, 'V')}`} />
      </>
    );
  } else if (run.kind === 'thermal' && a.thermal) {
    const th = a.thermal;
    figures = (
      <>
        <Figure label="Peak surface" value={celsius(th.maxC)} detail={`After ${formatElapsed(th.maxAtS)}, from ${celsius(th.startC)}`} />
        <Figure
          label="Steady state"
          value={th.steadyState.reached ? celsius(th.steadyState.temperatureC) : 'not reached'}
          detail={th.steadyState.reached ? `From ${formatElapsed(th.steadyState.fromS)}` : 'Still changing at the end'}
        />
        <Figure
          label={th.thresholdC !== null ? `Time to ${sig(th.thresholdC, 3)} °C` : 'Time to a temperature'}
          value={th.thresholdC === null ? '—' : th.timeToThresholdS === null ? 'not reached' : formatElapsed(th.timeToThresholdS)}
          detail={th.thresholdC === null ? 'Set a temperature in the analysis settings' : 'Interpolated between samples'}
        />
        <Figure
          label="Burn threshold"
          value={`${th.burnThreshold.temperatureC} °C`}
          detail={`${SURFACE_MATERIAL.labels[th.burnThreshold.material]}, ${formatElapsed(th.burnThreshold.contactSeconds)} contact`}
        />
        <Figure
          label="Margin to the threshold"
          value={<span className={th.marginC < 0 ? 'text-brick-700' : undefined}>{`${th.marginC >= 0 ? '+' : '−'}${sig(Math.abs(th.marginC), 2)} °C`}</span>}
          detail={th.timeToBurnThresholdS !== null ? `Threshold crossed after ${formatElapsed(th.timeToBurnThresholdS)}` : 'Threshold never reached'}
        />
        {a.wattHours !== null && <Figure label="Heater energy" value={formatQuantity(a.wattHours, 'Wh')} detail={`Over ${formatElapsed(a.durationS)}`} tone="energy" />}
      </>
    );
  } else if (run.kind === 'power-bank' && a.powerBank) {
    const pb = a.powerBank;
    figures = (
      <>
        <Figure label="Energy at the output" value={formatQuantity(a.wattHours, 'Wh')} detail={`Over ${formatElapsed(a.durationS)}`} tone="energy" />
        <Figure label="Charge at the output" value={formatQuantity(a.ampHours, 'Ah')} detail={`At ${formatQuantity(a.averageVolts, 'V')} average`} />
        <Figure label="As Ah at 5 V" value={formatQuantity(pb.ampHoursAt5V, 'Ah')} detail="Output Wh ÷ 5 V" />
        <Figure label="Conversion efficiency" value={`${sig(pb.efficiency * 100, 3)} %`} detail="Output Wh ÷ cell Wh" tone="energy" />
        <Figure label="Cell energy" value={formatQuantity(pb.cellEnergyWh, 'Wh')} detail={pb.cellEnergySource.replace(/\s*\(".*"\)/, '').replace(/:.*$/, '')} />
      </>
    );
  }
  // The hot-surface caution already says what the burn-threshold warning says.
  const warnings = run.kind === 'thermal' ? a.warnings.filter((w) => !w.includes('burn threshold')) : a.warnings;
  return (
    <div className="space-y-3">
      <dl className="grid grid-cols-2 gap-2 md:grid-cols-3">{figures}</dl>
      {run.kind === 'thermal' && a.thermal && <HotSurface run={run} />}
      <RunComparison run={run} />
      {warnings.length > 0 && (
        <ul className="space-y-1 text-sm text-amber-800" aria-label="Warnings">
          {warnings.map((w) => (
            <li key={w} className="flex gap-2">
              <TriangleAlert className="mt-0.5 size-4 shrink-0" aria-hidden />
              {w}
            </li>
          ))}
        </ul>
      )}
      {a.notes.length > 0 && (
        <ul className="list-disc space-y-0.5 pl-5 text-xs text-graphite-500" aria-label="Assumptions">
          {a.notes.map((n) => (
            <li key={n}>{n}</li>
          ))}
        </ul>
      )}
      {run.kind === 'thermal' && a.thermal && (
        <p className="text-xs text-graphite-500">
          Threshold source: {a.thermal.burnThreshold.source}. Steady state: {a.thermal.steadyState.criterion}.
        </p>
      )}
    </div>
  );
}
