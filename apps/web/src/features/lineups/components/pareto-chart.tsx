// The scatter chart of two metrics with the Pareto frontier (recharts, loaded on demand). Every
// point and the frontier come from the API; the chart only draws them.
import { CartesianGrid, LabelList, ResponsiveContainer, Scatter, ScatterChart, Tooltip, XAxis, YAxis } from 'recharts';
import type { ComparisonDto, ComparisonMetricDto } from '@splitcase/contracts';
import { CHART_COLOURS, metricHeader, metricText, seriesVar } from './display';

interface Point {
  deviceId: number;
  x: number;
  y: number;
  onFrontier: boolean;
  name: string;
  short: string;
}

const axisTick = { fontSize: 11, fill: 'var(--chart-axis)' };
const axisLabel = { fontSize: 11, fill: 'var(--chart-axis)' };

function PointTooltip({ active, payload, mx, my }: { active?: boolean; payload?: { payload: Point }[]; mx: ComparisonMetricDto; my: ComparisonMetricDto }) {
  const p = active ? payload?.[0]?.payload : undefined;
  if (!p) return null;
  return (
    <div className="rounded-md border border-graphite-150 bg-white px-3 py-2 text-xs shadow-pop">
      <p className="font-semibold text-graphite-950">{p.name}</p>
      <p className="num text-graphite-700">
        {mx.label}: {metricText(p.x, mx)}
      </p>
      <p className="num text-graphite-700">
        {my.label}: {metricText(p.y, my)}
      </p>
      <p className={p.onFrontier ? 'text-series-vermilion font-medium' : 'text-graphite-500'}>{p.onFrontier ? 'On the Pareto frontier' : 'Beaten on both axes by a frontier device'}</p>
    </div>
  );
}

export default function ParetoChart({ comparison, size }: { comparison: ComparisonDto; size?: { width: number; height: number } }) {
  const { pareto } = comparison;
  const mx = comparison.metrics.find((m) => m.key === pareto.x)!;
  const my = comparison.metrics.find((m) => m.key === pareto.y)!;
  const rows = new Map(comparison.rows.map((r) => [r.deviceId, r]));
  const points: Point[] = pareto.points.map((p) => ({ ...p, name: rows.get(p.deviceId)?.device.label ?? `Device ${p.deviceId}`, short: rows.get(p.deviceId)?.device.model ?? '' }));
  const byId = new Map(points.map((p) => [p.deviceId, p]));
  const frontier = pareto.deviceIds.map((id) => byId.get(id)!).filter(Boolean);
  const others = points.filter((p) => !p.onFrontier);

  const chart = (
    <ScatterChart width={size?.width} height={size?.height} margin={{ top: 12, right: 84, bottom: 28, left: 16 }}>
      <CartesianGrid stroke="var(--chart-grid)" />
      <XAxis
        type="number"
        dataKey="x"
        name={mx.label}
        domain={['auto', 'auto']}
        tick={axisTick}
        tickFormatter={(v: number) => metricText(v, mx)}
        label={{ value: metricHeader(mx), position: 'insideBottom', offset: -16, style: axisLabel }}
      />
      <YAxis
        type="number"
        dataKey="y"
        name={my.label}
        domain={['auto', 'auto']}
        tick={axisTick}
        width={78}
        tickFormatter={(v: number) => metricText(v, my)}
        label={{ value: metricHeader(my), angle: -90, position: 'insideLeft', offset: 4, style: { ...axisLabel, textAnchor: 'middle' } }}
      />
      <Tooltip cursor={{ strokeDasharray: '3 3' }} content={<PointTooltip mx={mx} my={my} />} />
      <Scatter name="Dominated" data={others} fill={seriesVar('blue')} shape="circle" isAnimationActive={false}>
        <LabelList dataKey="short" position="right" style={{ fontSize: 10, fill: 'var(--chart-axis)' }} />
      </Scatter>
      <Scatter
        name="Pareto frontier"
        data={frontier}
        fill={seriesVar('vermilion')}
        shape="diamond"
        line={{ stroke: seriesVar('vermilion'), strokeWidth: 2, strokeDasharray: '6 3' }}
        lineJointType="linear"
        isAnimationActive={false}
      >
        <LabelList dataKey="short" position="right" style={{ fontSize: 10, fill: 'var(--chart-axis)' }} />
      </Scatter>
    </ScatterChart>
  );

  return (
    <div className={CHART_COLOURS}>
      {size ? (
        <div data-testid="pareto-chart">{chart}</div>
      ) : (
        <div className="h-96" data-testid="pareto-chart">
          <ResponsiveContainer width="100%" height="100%">
            {chart}
          </ResponsiveContainer>
        </div>
      )}
      <ul className="mt-2 flex flex-wrap gap-x-5 gap-y-1 text-xs text-graphite-600" aria-label="Legend">
        <li className="inline-flex items-center gap-1.5">
          <svg viewBox="0 0 10 10" className="size-3" aria-hidden>
            <path d="M5 0 L10 5 L5 10 L0 5 Z" fill={seriesVar('vermilion')} />
          </svg>
          On the Pareto frontier (dashed line): no other device is better on both axes
        </li>
        <li className="inline-flex items-center gap-1.5">
          <svg viewBox="0 0 10 10" className="size-3" aria-hidden>
            <circle cx="5" cy="5" r="4.5" fill={seriesVar('blue')} />
          </svg>
          Dominated
        </li>
      </ul>
    </div>
  );
}
