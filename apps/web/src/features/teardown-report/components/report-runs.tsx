import { TriangleAlert } from 'lucide-react';
import { RUN_KIND, SURFACE_MATERIAL, type RunDto } from '@splitcase/contracts';
import { formatQuantity, sig } from '@/lib/format';
import { NoneRecorded, ReportTable, duration } from './report-layout';

const celsius = (c: number | null | undefined) => (c === null || c === undefined ? '—' : `${sig(c)} °C`);
const percent = (fraction: number) => `${sig(fraction * 100)} %`;

/** The key numbers of a run's analysis, by kind, in one line each; `hot` marks a surface hot enough to burn. */
function keyResults(run: RunDto): { text: string; hot?: boolean }[] {
  const a = run.analysis;
  const out: { text: string; hot?: boolean }[] = [];
  const push = (text: string, hot = false) => out.push({ text, hot });
  if (a.discharge) {
    const d = a.discharge;
    push(`Mean ${formatQuantity(d.timeAverageVolts, 'V')}, ${formatQuantity(d.averageCurrentA, 'A')}, ${formatQuantity(d.averagePowerW, 'W')}; minimum ${formatQuantity(d.minVolts, 'V')}`);
    if (d.cutoff) {
      const held = d.cutoff.reason === 'cutoff-voltage' && d.cutoffDebounce ? `, held ${d.cutoffDebounce.seconds} s` : '';
      push(`Stopped at ${formatQuantity(d.cutoff.volts, 'V')} after ${duration(d.cutoff.t)} (${d.cutoff.reason.replace(/-/g, ' ')}${held})`);
    }
    const r = d.internalResistance;
    if (r)
      push(
        `DC resistance ${formatQuantity(r.ohms, 'Ω')} at the terminals: ${formatQuantity(r.lowAmps, 'A')} at ${formatQuantity(r.lowVolts, 'V', 4)} → ${formatQuantity(r.highAmps, 'A')} at ${formatQuantity(r.highVolts, 'V', 4)}`,
      );
  }
  if (a.charge) {
    const c = a.charge;
    push(`Constant current ${formatQuantity(c.cc.currentA, 'A')}${c.cv ? `, then constant voltage ${formatQuantity(c.cv.volts, 'V')}` : ''}; charge time ${duration(c.chargeTimeS)}`);
    push(c.terminated ? `Terminated at ${c.termination?.description ?? formatQuantity(c.terminationCurrentA, 'A')}` : 'Did not reach termination in the log');
  }
  if (a.thermal) {
    const th = a.thermal;
    push(`Peak ${celsius(th.maxC)} after ${duration(th.maxAtS)}${th.steadyState.reached ? `; steady ${celsius(th.steadyState.temperatureC)}` : '; no steady state in the log'}`);
    const b = th.burnThreshold;
    push(
      `${th.marginC < 0 ? `${sig(-th.marginC)} °C above` : `${sig(th.marginC)} °C below`} the ${celsius(b.temperatureC)} burn threshold for ${SURFACE_MATERIAL.labels[b.material].toLowerCase()} at ${b.contactSeconds} s contact (${b.source})`,
      th.marginC < 0,
    );
  }
  if (a.powerBank) {
    const p = a.powerBank;
    push(`${formatQuantity(p.ampHoursAt5V, 'Ah')} at 5 V; ${formatQuantity(p.cellEnergyWh, 'Wh')} in the cells (${p.cellEnergySource}); conversion ${percent(p.efficiency)}`);
  }
  return out;
}

function againstLabel(run: RunDto): string {
  const c = run.comparison;
  if (c.label)
    return `${sig(c.label.percent)} % of ${formatQuantity(c.label.claimedWh, 'Wh')}${c.label.labelBasis === 'label-ah-at-cell-volts' ? ` (${formatQuantity(c.label.claimedAh, 'Ah')} at the cell voltage)` : ''}${c.label.warning ? ' (below threshold)' : ''}`;
  if (c.labelEnergy) return `${sig(c.labelEnergy.percent)} % of ${formatQuantity(c.labelEnergy.claimedWh, 'Wh')}${c.labelEnergy.warning ? ' (below 80 %)' : ''}`;
  if (c.rated) return `${sig(c.rated.percent)} % of the cell rating`;
  return '—';
}

/** Bench runs with their key numbers (the charts stay in the workspace; the numbers come from the same analysis). */
export function ReportRuns({ runs }: { runs: RunDto[] }) {
  if (!runs.length) return <NoneRecorded>No bench runs recorded.</NoneRecorded>;
  return (
    <ReportTable label="Bench runs" head={['Run', 'Duration', 'Delivered', 'Key results', 'Against the label']}>
      {runs.map((r) => (
        <tr key={r.id} data-run={r.id}>
          <td>
            <span className="text-graphite-950">{r.label}</span>
            <span className="block text-2xs text-graphite-500">{RUN_KIND.labels[r.kind]}</span>
          </td>
          <td className="num whitespace-nowrap">{duration(r.analysis.durationS)}</td>
          <td className="num whitespace-nowrap">
            {r.analysis.ampHours !== null ? formatQuantity(r.analysis.ampHours, 'Ah') : '—'}
            {r.analysis.wattHours !== null && <span className="block">{formatQuantity(r.analysis.wattHours, 'Wh')}</span>}
          </td>
          <td className="text-2xs">
            {keyResults(r).map((line) => (
              <span key={line.text} className={`block ${line.hot ? 'font-medium text-brick-700' : ''}`}>
                {line.hot && (
                  <span className="mr-1 inline-flex items-center gap-0.5 uppercase">
                    <TriangleAlert className="inline size-3" aria-hidden /> Hot:
                  </span>
                )}
                {line.text}
              </span>
            ))}
          </td>
          <td className="num text-2xs">{againstLabel(r)}</td>
        </tr>
      ))}
    </ReportTable>
  );
}
