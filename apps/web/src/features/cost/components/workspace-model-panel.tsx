import { toast } from 'sonner';
import { ErrorPanel } from '@/components/error-boundary';
import { Card, Spinner } from '@/components/page';
import { formatDateTime } from '@/lib/format';
import { useCostModel, useSaveCostModel } from '../api/cost-model';
import { CostModelForm } from './cost-model-form';

/** The workspace cost-model defaults (every teardown without its own model is costed with them). */
export function WorkspaceModelPanel() {
  const model = useCostModel();
  const save = useSaveCostModel();
  if (model.isPending) return <Spinner />;
  if (model.isError) return <ErrorPanel error={model.error} onRetry={() => model.refetch()} />;
  const { updatedAt, updatedBy } = model.data;
  return (
    <Card
      title="Cost-model defaults"
      actions={<span className="text-xs text-graphite-500">{updatedAt ? `Changed ${formatDateTime(updatedAt)}${updatedBy ? ` by ${updatedBy}` : ''}` : 'Built-in defaults'}</span>}
    >
      <div className="p-4">
        <CostModelForm
          key={updatedAt ?? 'built-in'}
          initial={model.data.model}
          busy={save.isPending}
          submitLabel="Save defaults"
          onSubmit={async (body) => {
            await save.mutateAsync(body);
            toast.success('Cost-model defaults saved; teardowns without their own model use them now.');
          }}
        />
      </div>
    </Card>
  );
}
