import { Link, useNavigate, useParams } from 'react-router';
import { toast } from 'sonner';
import { RequireRole } from '@/app/guards';
import { ErrorPanel } from '@/components/error-boundary';
import { PageHeader, Spinner } from '@/components/page';
import { paths } from '@/config/paths';
import { useDevice } from '@/features/devices/api/get-device';
import { useUpdateDevice } from '@/features/devices/api/update-device';
import { DeviceForm } from '@/features/devices/components/device-form';

export function Component() {
  const id = Number(useParams().id);
  const navigate = useNavigate();
  const device = useDevice(id);
  const update = useUpdateDevice();
  return (
    <RequireRole roles={['engineer', 'admin']}>
      {device.isPending ? (
        <Spinner />
      ) : device.isError ? (
        <ErrorPanel error={device.error} onRetry={() => device.refetch()} />
      ) : (
        <>
          <PageHeader
            eyebrow={
              <Link to={paths.device(id)} className="hover:text-copper-700">
                {device.data.device.maker} {device.data.device.model}
              </Link>
            }
            title="Edit device"
            subtitle="Label claims feed the figures of every teardown of this device."
          />
          <DeviceForm
            initial={device.data.device}
            submitLabel="Save device"
            onCancel={() => navigate(paths.device(id))}
            onSubmit={async (values) => {
              await update.mutateAsync({ id, ...values });
              toast.success('Device saved.');
              navigate(paths.device(id));
            }}
          />
        </>
      )}
    </RequireRole>
  );
}
