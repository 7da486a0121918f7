import { lazy, Suspense, useEffect, useMemo, useState } from 'react';
import { toast } from 'sonner';
import { CircleAlert, RotateCcw, Save } from 'lucide-react';
import {
  ESTIMATES_NOTE,
  HOT_SURFACE_CAUTION,
  LINEUP_METRIC_KEYS,
  LINEUP_WEIGHT_MAX,
  lineupModeChoice,
  type ComparisonDto,
  type LineupDto,
  type LineupMetricKey,
  type LineupModeChoice,
} from '@splitcase/contracts';
import { Button } from '@/components/button';
import { ErrorPanel } from '@/components/error-boundary';
import { Select } from '@/components/field';
import { Card, Spinner } from '@/components/page';
import { EstimatesNote, HotSurfaceNote } from '@/components/safety';
import { ApiError } from '@/lib/api-client';
import { formatDate } from '@/lib/format';
import { useDebouncedValue } from '@/lib/use-debounced-value';
import { useComparison, type Axes } from '../api/comparison';
import { usePreviewComparison } from '../api/preview-comparison';
import { useUpdateLineup } from '../api/update-lineup';
import { ComparisonTable } from './comparison-table';
import { betterText, coverageText, lackedMetricsText, modeChoiceText, sameModeChoice, scoreText } from './display';
import { ModeChoice } from './mode-choice';
import { ParetoTable } from './pareto-table';
import { WeightSliders } from './weight-sliders';

const ParetoChart = lazy(() => import('./pareto-chart'));

const sameWeights = (a: Record<string, number>, b: Record<string, number>) => LINEUP_METRIC_KEYS.every((k) => (a[k] ?? 0) === (b[k] ?? 0));

/** The ranking, best first, as the server scored it; rows that lack a weighted metric come after the complete ones, under their own heading. */
function Ranking({ comparison }: { comparison: ComparisonDto }) {
  const firstIncomplete = comparison.rows.findIndex((r) => !r.complete);
  return (
    <ol className="space-y-1.5" aria-label="Ranking">
      {comparison.rows.map((r, k) => {
        const lacks = lackedMetricsText(r, comparison.metrics);
        return (
          <li key={r.deviceId} className="space-y-1.5">
            {k === firstIncomplete && (
              <p className="flex items-center gap-1.5 border-t border-graphite-150 pt-2 text-xs font-semibold uppercase tracking-wide text-graphite-600" data-testid="ranking-incomplete-heading">
                <CircleAlert className="size-3.5 text-amber-700" aria-hidden />
                Incomplete: ranked after every complete device
              </p>
            )}
            <div className="grid grid-cols-[1.5rem_minmax(0,1fr)_3rem] items-center gap-2 text-sm" data-testid="ranking-row" data-complete={r.complete ? 'true' : 'false'}>
              <span className="num text-right font-semibold text-graphite-500">{r.rank}</span>
              <span className="min-w-0">
                <span className="block truncate font-medium text-graphite-950">{r.device.label}</span>
                {lacks && (
                  <span className="block text-xs text-amber-800" data-testid="ranking-lacks">
                    Incomplete, lacks {lacks}
                  </span>
                )}
                {coverageText(r.coverage) && (
                  <span className="block text-xs text-graphite-600" title="The other weighted metrics are missing for this device: its score rests on fewer figures than the others'.">
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
            </div>
          </li>
        );
      })}
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
  const [mode, setMode] = useState<LineupModeChoice>(lineup.mode);
  const [modeError, setModeError] = useState<string | undefined>();
  // A saved change (here or elsewhere) becomes the starting point again.
  useEffect(() => setWeights(lineup.weights), [lineup.weights]);
  useEffect(() => setMode(lineup.mode), [lineup.mode]);
  const draft = useMemo(() => ({ weights, mode }), [weights, mode]);
  const debounced = useDebouncedValue(draft, 350);
  const dirty = !sameWeights(weights, lineup.weights);
  const modeDirty = !sameModeChoice(mode, lineup.mode);
  const previewing = !sameWeights(debounced.weights, lineup.weights) || !sameModeChoice(debounced.mode, lineup.mode);
  const noWeight = !Object.values(weights).some((w) => w > 0);
  // A mode by name without a name is not sent: the field says what is missing.
  const modeCheck = lineupModeChoice.safeParse(debounced.mode);
  const modeProblem = lineupModeChoice.safeParse(mode).success ? undefined : 'Give the mode name to compare.';

  const saved = useComparison(lineup.id, axes);
  const previewChoice = previewing && Object.values(debounced.weights).some((w) => w > 0) && modeCheck.success ? { weights: debounced.weights, mode: modeCheck.data } : null;
  const preview = usePreviewComparison(lineup.id, previewChoice, axes);
  const data = previewing && preview.data ? preview.data : saved.data;
  const update = useUpdateLineup();
  const saveMode = useUpdateLineup();

  const metricOptions = useMemo(() => (data?.metrics ?? []).filter((m) => m.applies), [data]);
  if (saved.isPending) return <Spinner label="Working out the comparison…" />;
  if (saved.isError) return <ErrorPanel error={saved.error} onRetry={() => saved.refetch()} />;
  const c = data!;
  const hot = c.rows.some((r) => r.device.category === 'pocket-heater');
  const updating = (previewing && preview.isFetching) || saved.isFetching || debounced !== draft;
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

  const onSaveMode = () => {
    const parsed = lineupModeChoice.safeParse(mode);
    if (!parsed.success) {
      setModeError(parsed.error.issues[0]?.message ?? 'Give the mode name to compare.');
      return;
    }
    setModeError(undefined);
    saveMode.mutate(
      { id: lineup.id, mode: parsed.data, version: lineup.version },
      {
        onSuccess: () => toast.success('Mode saved.'),
        onError: (err) => {
          const field = err instanceof ApiError ? (err.fields['mode.name'] ?? err.fields.mode) : undefined;
          if (field) setModeError(field);
          else toast.error(err.message);
        },
      },
    );
  };
  const previewFailed = preview.isError && previewing;
  const previewModeError = previewFailed && preview.error instanceof ApiError ? (preview.error.fields['mode.name'] ?? preview.error.fields.mode) : undefined;

  return (
    <div className="space-y-5">
      <Card
        title="Operating mode compared"
        actions={
          <span className="text-xs text-graphite-500" aria-live="polite" data-testid="mode-state">
            {modeDirty ? 'Unsaved mode' : `Saved: ${modeChoiceText(lineup.mode)}`}
          </span>
        }
      >
        <div className="space-y-3 p-4">
          <p className="text-sm text-graphite-600">
            Each device’s runtime comes from one of the operating modes recorded in its teardown. The comparison says, per device, which mode it took and why; a device without a matching mode has no
            runtime here, never a guess.
          </p>
          <ModeChoice
            value={mode}
            onChange={(next) => {
              setMode(next);
              setModeError(undefined);
            }}
            error={modeError ?? previewModeError ?? modeProblem}
            layout="row"
            hideLegend
          />
          <div className="flex flex-wrap items-center gap-2">
            {lineup.permissions.edit && (
              <Button variant="primary" size="sm" onClick={onSaveMode} disabled={!modeDirty || Boolean(modeProblem)} busy={saveMode.isPending}>
                <Save className="size-4" aria-hidden /> Save mode
              </Button>
            )}
            <Button
              size="sm"
              onClick={() => {
                setMode(lineup.mode);
                setModeError(undefined);
              }}
              disabled={!modeDirty}
            >
              <RotateCcw className="size-4" aria-hidden /> Back to saved mode
            </Button>
            {!lineup.permissions.edit && <span className="text-xs text-graphite-500">Try another mode here; it is not saved.</span>}
          </div>
        </div>
      </Card>

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
            Hover a value to see where it comes from; a “—” is missing (hover it for why) and is left out of the ranking, never counted as zero. A device marked “Incomplete” lacks a weighted metric:
            its score rests on the others, and it ranks after every complete device.
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
            {previewFailed && !previewModeError ? <ErrorPanel error={preview.error} /> : <Ranking comparison={c} />}
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
