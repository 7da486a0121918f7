import { useState } from 'react';
import { toast } from 'sonner';
import { Button } from '@/components/button';
import { ErrorPanel } from '@/components/error-boundary';
import { Card, Spinner } from '@/components/page';
import { formatDateTime, formatPercent } from '@/lib/format';
import { useClearTeardownCostModel, useSaveTeardownCostModel, useTeardownCostModel } from '../api/teardown-cost-model';
import { CostModelForm } from './cost-model-form';
import { plain } from './display';

/** The cost model this teardown is costed with; price editors may give it its own. */
export function TeardownModelCard({ teardownId, canEdit }: { teardownId: number; canEdit: boolean }) {
  const info = useTeardownCostModel(teardownId);
  const save = useSaveTeardownCostModel(teardownId);
  const clear = useClearTeardownCostModel(teardownId);
  const [open, setOpen] = useState(false);
  if (info.isPending) return <Spinner />;
  if (info.isError) return <ErrorPanel error={info.error} onRetry={() => info.refetch()} />;
  const { model, source, updatedAt, updatedBy } = info.data;
  const cur = model.currency;
  const facts: [string, string][] = [
    ['Volumes', model.volumes.map((v) => v.toLocaleString('en-GB')).join(' · ')],
    ['SMT placement', `${plain(model.smtCostPerPlacement)} ${cur}`],
    ['Through-hole joint', `${plain(model.thtCostPerJoint)} ${cur}`],
    ['Labour rate', `${plain(model.labourRatePerHour)} ${cur}/h`],
    ['Manual operations', model.manualOperations.length ? model.manualOperations.map((o) => `${o.label} ${plain(o.minutes)} min`).join(' · ') : 'none'],
    ['Test', `${plain(model.testMinutes)} min per unit`],
    ['Packing', `${plain(model.packagingCost)} ${cur}`],
    ['Yield', formatPercent(model.firstPassYield)],
    ['Overhead · freight · duty', `${formatPercent(model.overheadFraction)} · ${formatPercent(model.freightFraction)} · ${formatPercent(model.dutyFraction)}`],
    ['Retailer · platform', `${formatPercent(model.retailMarginFraction)} · ${formatPercent(model.platformMarginFraction)}`],
    ['Band high · medium · low', `± ${formatPercent(model.confidenceBand.high, 0)} · ${formatPercent(model.confidenceBand.medium, 0)} · ${formatPercent(model.confidenceBand.low, 0)}`],
  ];
  return (
    <Card
      title={source === 'teardown' ? 'Cost model of this teardown' : 'Cost model (workspace defaults)'}
      actions={
        canEdit && !open ? (
          <Button size="sm" variant="quiet" onClick={() => setOpen(true)}>
            {source === 'teardown' ? 'Edit' : 'Use own model here'}
          </Button>
        ) : undefined
      }
    >
      {open ? (
        <div className="p-4">
          <CostModelForm
            initial={model}
            busy={save.isPending}
            submitLabel="Save for this teardown"
            onSubmit={async (body) => {
              await save.mutateAsync(body);
              toast.success('This teardown now has its own cost model; totals updated.');
              setOpen(false);
            }}
            extraActions={
              <>
                <Button onClick={() => setOpen(false)}>Cancel</Button>
                {source === 'teardown' && (
                  <Button
                    variant="danger"
                    busy={clear.isPending}
                    onClick={async () => {
                      await clear.mutateAsync();
                      toast.success('Back to the workspace cost model.');
                      setOpen(false);
                    }}
                  >
                    Back to workspace defaults
                  </Button>
                )}
              </>
            }
          />
        </div>
      ) : (
        <dl className="grid grid-cols-[auto_minmax(0,1fr)] gap-x-4 gap-y-1 p-4 text-sm">
          {facts.map(([k, v]) => (
            <div key={k} className="contents">
              <dt className="text-graphite-500">{k}</dt>
              <dd className="num text-graphite-900">{v}</dd>
            </div>
          ))}
          <dt className="text-graphite-500">Changed</dt>
          <dd className="text-graphite-600">{updatedAt ? `${formatDateTime(updatedAt)}${updatedBy ? ` by ${updatedBy}` : ''}` : 'built-in defaults'}</dd>
        </dl>
      )}
    </Card>
  );
}
