import { useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router';
import { toast } from 'sonner';
import { Pencil, Play, Trash2 } from 'lucide-react';
import { DEVICE_CATEGORY } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { Dialog } from '@/components/dialog';
import { ErrorPanel } from '@/components/error-boundary';
import { PageHeader, Spinner } from '@/components/page';
import { paths } from '@/config/paths';
import { confirmDialog } from '@/lib/confirm';
import { useSignedInUser } from '@/lib/session';
import { useDeleteDevice } from '@/features/devices/api/delete-device';
import { useDevice } from '@/features/devices/api/get-device';
import { DeviceFacts } from '@/features/devices/components/device-facts';
import { DeviceTeardowns } from '@/features/devices/components/device-teardowns';
import { StartTeardownForm } from '@/features/teardowns/components/start-teardown-form';

/** A device: what it is and claims, and its teardowns, with "Start a teardown". */
export function Component() {
  const id = Number(useParams().id);
  const me = useSignedInUser();
  const navigate = useNavigate();
  const device = useDevice(id);
  const remove = useDeleteDevice();
  const [starting, setStarting] = useState(false);
  if (!Number.isInteger(id) || id <= 0) return <ErrorPanel error={new Error('This address does not name a device.')} />;
  if (device.isPending) return <Spinner />;
  if (device.isError) return <ErrorPanel error={device.error} onRetry={() => device.refetch()} />;
  const { device: d, teardowns } = device.data;
  const canEdit = me.role === 'engineer' || me.role === 'admin';
  const onDelete = async () => {
    const ok = await confirmDialog({
      title: `Delete ${d.maker} ${d.model}?`,
      message: 'The device has no teardown; it is removed from the list. The audit log keeps a line saying it was deleted.',
      confirmLabel: 'Delete device',
      tone: 'danger',
    });
    if (!ok) return;
    remove.mutate(d.id, {
      onSuccess: () => {
        toast.success('Device deleted.');
        navigate(paths.devices());
      },
      onError: (err) => toast.error(err.message),
    });
  };
  const start = canEdit ? (
    <Button variant="primary" size="sm" onClick={() => setStarting(true)}>
      <Play className="size-4" aria-hidden /> Start a teardown
    </Button>
  ) : undefined;
  return (
    <>
      <PageHeader
        eyebrow={
          <Link to={paths.devices()} className="hover:text-copper-700">
            Devices
          </Link>
        }
        title={`${d.maker} ${d.model}`}
        subtitle={DEVICE_CATEGORY.labels[d.category]}
        actions={
          <>
            {canEdit && (
              <Link to={paths.editDevice(d.id)}>
                <Button tabIndex={-1}>
                  <Pencil className="size-4" aria-hidden /> Edit
                </Button>
              </Link>
            )}
            {me.role === 'admin' && (
              <Button variant="danger" onClick={onDelete} disabled={d.teardownCount > 0} title={d.teardownCount > 0 ? 'A device with teardowns cannot be deleted.' : undefined}>
                <Trash2 className="size-4" aria-hidden /> Delete
              </Button>
            )}
          </>
        }
      />
      <div className="space-y-5">
        <DeviceFacts device={d} />
        <DeviceTeardowns teardowns={teardowns} action={start} />
      </div>
      <Dialog open={starting} onClose={() => setStarting(false)} title={`Start a teardown of the ${d.model}`} wide>
        {starting && (
          <StartTeardownForm
            deviceId={d.id}
            onCancel={() => setStarting(false)}
            onStarted={(t) => {
              toast.success('Teardown started.');
              navigate(paths.teardown(t.id));
            }}
          />
        )}
      </Dialog>
    </>
  );
}
