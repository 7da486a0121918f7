import type { ComparisonDto } from '@splitcase/contracts';
import { metricHeader, metricText, betterText } from './display';

/** The data of the scatter chart: each device's two values, whether it is on the frontier, and who is left off and why. */
export function ParetoTable({ comparison }: { comparison: ComparisonDto }) {
  const { pareto } = comparison;
  const mx = comparison.metrics.find((m) => m.key === pareto.x)!;
  const my = comparison.metrics.find((m) => m.key === pareto.y)!;
  const label = new Map(comparison.rows.map((r) => [r.deviceId, r.device.label]));
  const order = new Map(pareto.deviceIds.map((id, k) => [id, k]));
  const points = [...pareto.points].sort((a, b) => (order.get(a.deviceId) ?? 99) - (order.get(b.deviceId) ?? 99) || a.x - b.x);
  return (
    <div>
      <table className="w-full text-sm" aria-label="Scatter chart, data">
        <caption className="pb-1 text-left text-xs text-graphite-500">
          {mx.label}: {betterText(mx)}; {my.label}: {betterText(my)}.
        </caption>
        <thead>
          <tr className="border-b border-graphite-150 text-left text-xs uppercase tracking-wide text-graphite-500">
            <th className="py-1 font-semibold">Device</th>
            <th className="py-1 text-right font-semibold">{metricHeader(mx)}</th>
            <th className="py-1 text-right font-semibold">{metricHeader(my)}</th>
            <th className="py-1 pl-3 font-semibold">Pareto frontier</th>
          </tr>
        </thead>
        <tbody>
          {points.map((p) => (
            <tr key={p.deviceId} className="border-b border-graphite-100 last:border-0">
              <td className="py-1">{label.get(p.deviceId)}</td>
              <td className="num py-1 text-right">{metricText(p.x, mx)}</td>
              <td className="num py-1 text-right">{metricText(p.y, my)}</td>
              <td className="py-1 pl-3">{p.onFrontier ? <span className="font-medium text-graphite-950">◆ On the frontier</span> : <span className="text-graphite-500">● Dominated</span>}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {pareto.leftOut.length > 0 && (
        <div className="mt-2 text-xs text-graphite-600">
          <p className="font-medium">Not on the chart:</p>
          <ul className="list-disc pl-4">
            {pareto.leftOut.map((l) => (
              <li key={l.deviceId}>
                {label.get(l.deviceId)} — {l.reason}
              </li>
            ))}
          </ul>
        </div>
      )}
    </div>
  );
}
