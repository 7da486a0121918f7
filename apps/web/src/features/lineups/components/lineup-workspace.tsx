import { lazy, Suspense, useEffect, useMemo, useState } from 'react';
import { toast } from 'sonner';
import { RotateCcw, Save } from 'lucide-react';
import { ESTIMATES_NOTE, HOT_SURFACE_CAUTION, LINEUP_METRIC_KEYS, LINEUP_WEIGHT_MAX, type ComparisonDto, type LineupDto, type LineupMetricKey } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { ErrorPanel } from '@/components/error-boundary';
import { Select } from '@/components/field';
import { Card, Spinner } from '@/components/page';
import { EstimatesNote, HotSurfaceNote } from '@/components/safety';
import { formatDate } from '@/lib/format';
import { useDebouncedValue } from '@/lib/use-debounced-value';
import { useComparison, type Axes } from '../api/comparison';
import { usePreviewComparison } from '../api/preview-comparison';
import { useUpdateLineup } from '../api/update-lineup';
import { ComparisonTable } from './comparison-table';
import { betterText, coverageText, scoreText } from './display';
import { ParetoTable } from './pareto-table';
import { WeightSliders } from './weight-sliders';

const ParetoChart = lazy(() => import('./pareto-chart'));

const sameWeights = (a: Record<string, number>, b: Record<string, number>) => LINEUP_METRIC_KEYS.every((k) => (a[k] ?? 0) === (b[k] ?? 0));

/** The ranking, best first, as the server scored it. */
function Ranking({ comparison }: { comparison: ComparisonDto }) {
  return (
    <ol className="space-y-1.5" aria-label="Ranking">
      {comparison.rows.map((r) => (
        <li key={r.deviceId} className="grid grid-cols-[1.5rem_minmax(0,1fr)_3rem] items-center gap-2 text-sm" data-testid="ranking-row">
          <span className="num text-right font-semibold text-graphite-500">{r.rank}</span>
          <span className="min-w-0">
            <span className="block truncate font-medium text-graphite-950">{r.device.label}</span>
            {coverageText(r.coverage) && (
              <span className="block text-xs text-amber-800" title="The other weighted metrics are missing for this device: its score rests on fewer figures than the others'.">
                Scored {coverageText(r.coverage)}
              </span>
            )}
            <span className="mt-0.5 block h-1.5 rounded-full bg-graphite-100" aria-hidden>
              <span className="block h-1.5 rounded-full bg-copper-500" style={{ width: `${r.score ?? 0}%` }} />
            </span>
          </span>
          <span className="num text-right font-semibold text-copper-800" title="Score 0–100">
            {scoreText(r.score)}
          </span>
        </li>
      ))}
    </ol>
  );
}

/**
 * The lineup page's working area: the normalised comparison, the scatter chart of two metrics
 * with its Pareto frontier, and the weighted ranking. Moving a slider asks the server for the
 * ranking with the new weights (debounced); saving PATCHes the lineup.
 */
export function LineupWorkspace({ lineup, axes, onAxes }: { lineup: LineupDto; axes: Axes; onAxes: (axes: Axes) => void }) {
  const [weights, setWeights] = useState<Record<string, number>>(lineup.weights);
  // A saved change (here or elsewhere) becomes the starting point again.
  useEffect(() => setWeights(lineup.weights), [lineup.weights]);
  const debounced = useDebouncedValue(weights, 350);
  const dirty = !sameWeights(weights, lineup.weights);
  const previewing = !sameWeights(debounced, lineup.weights);
  const noWeight = !Object.values(weights).some((w) => w > 0);

  const saved = useComparison(lineup.id, axes);
  const preview = usePreviewComparison(lineup.id, previewing && Object.values(debounced).some((w) => w > 0) ? debounced : null, axes);
  const data = previewing && preview.data ? preview.data : saved.data;
  const update = useUpdateLineup();

  const metricOptions = useMemo(() => (data?.metrics ?? []).filter((m) => m.applies), [data]);
  if (saved.isPending) return <Spinner label="Working out the comparison…" />;
  if (saved.isError) return <ErrorPanel error={saved.error} onRetry={() => saved.refetch()} />;
  const c = data!;
  const hot = c.rows.some((r) => r.device.category === 'pocket-heater');
  const updating = (previewing && preview.isFetching) || saved.isFetching || debounced !== weights;
  const axisPicker = (which: 'x' | 'y') => (
    <label className="flex items-center gap-2 text-sm">
      <span className="shrink-0 text-graphite-600">{which === 'x' ? 'Across' : 'Up'}</span>
      <Select
        aria-label={which === 'x' ? 'Metric across (x axis)' : 'Metric up (y axis)'}
        value={c.pareto[which]}
        onChange={(e) => {
          const value = e.target.value as LineupMetricKey;
          const other = which === 'x' ? c.pareto.y : c.pareto.x;
          // Picking the other axis's metric swaps the two.
          const next = which === 'x' ? { x: value, y: value === other ? c.pareto.x : other } : { x: value === other ? c.pareto.y : other, y: value };
          onAxes(next);
        }}
        className="h-8 w-56 text-sm"
      >
        {metricOptions.map((m) => (
          <option key={m.key} value={m.key}>
            {m.short} ({betterText(m)})
          </option>
        ))}
      </Select>
    </label>
  );

  const save = () =>
    update.mutate(
      { id: lineup.id, weights, version: lineup.version },
      {
        onSuccess: () => toast.success('Weights saved.'),
        onError: (err) => toast.error(err.message),
      },
    );

  return (
    <div className="space-y-5">
      <Card
        title="Normalised comparison"
        actions={
          <span className="text-xs text-graphite-500" data-testid="rate-date">
            {c.currency} · {c.rateDate ? `rates of ${formatDate(c.rateDate)}` : 'no rate table'}
          </span>
        }
      >
        <div className="space-y-3 p-4">
          <ComparisonTable comparison={c} />
          <p className="text-xs text-graphite-500">
            Hover a value to see where it comes from; a “—” is missing (hover it for why) and is left out of the ranking, never counted as zero. A score marked * rests on only some of the weighted
            metrics.
          </p>
          {c.notes
            .filter((n) => n !== ESTIMATES_NOTE && n !== HOT_SURFACE_CAUTION)
            .map((n) => (
            <p key={n} className="text-xs text-amber-800">
              {n}
            </p>
          ))}
          <EstimatesNote />
          {hot && <HotSurfaceNote />}
        </div>
      </Card>

      <div className="grid items-start gap-5 xl:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <Card title="Scatter chart and Pareto frontier">
          <div className="space-y-4 p-4">
            <div className="flex flex-wrap gap-x-5 gap-y-2">
              {axisPicker('x')}
              {axisPicker('y')}
            </div>
            {c.pareto.points.length === 0 ? (
              <p className="py-8 text-center text-sm text-graphite-500">No device has both values yet: pick other metrics, or record the missing figures.</p>
            ) : (
              <Suspense fallback={<Spinner label="Drawing the chart…" />}>
                <ParetoChart comparison={c} />
              </Suspense>
            )}
            <ParetoTable comparison={c} />
          </div>
        </Card>

        <Card
          title="Weighted ranking"
          actions={
            <span className="text-xs text-graphite-500" aria-live="polite">
              {updating ? 'Ranking…' : dirty ? 'Unsaved weights' : 'Saved weights'}
            </span>
          }
        >
          <div className="space-y-4 p-4">
            {preview.isError && previewing ? <ErrorPanel error={preview.error} /> : <Ranking comparison={c} />}
            <p className="text-xs text-graphite-500">
              Each weighted metric is scaled 0–1 across the lineup (1 = best); the score is their weighted mean × 100, over the metrics a device has. Worked out on the server.
            </p>
            <WeightSliders metrics={metricOptions} weights={weights} max={LINEUP_WEIGHT_MAX} onChange={(k, v) => setWeights((w) => ({ ...w, [k]: v }))} columns="auto" />
            {noWeight && (
              <p className="text-sm text-brick-700" role="alert">
                Give at least one metric a weight above zero.
              </p>
            )}
            <div className="flex flex-wrap gap-2">
              {lineup.permissions.edit && (
                <Button variant="primary" size="sm" onClick={save} disabled={!dirty || noWeight} busy={update.isPending}>
                  <Save className="size-4" aria-hidden /> Save weights
                </Button>
              )}
              <Button size="sm" onClick={() => setWeights(lineup.weights)} disabled={!dirty}>
                <RotateCcw className="size-4" aria-hidden /> Back to saved
              </Button>
            </div>
            {!lineup.permissions.edit && <p className="text-xs text-graphite-500">Try other weights here; they are not saved.</p>}
          </div>
        </Card>
      </div>
    </div>
  );
}
