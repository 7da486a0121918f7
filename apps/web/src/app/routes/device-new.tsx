import { useNavigate } from 'react-router';
import { toast } from 'sonner';
import { Link } from 'react-router';
import { RequireRole } from '@/app/guards';
import { PageHeader } from '@/components/page';
import { paths } from '@/config/paths';
import { useCreateDevice } from '@/features/devices/api/create-device';
import { DeviceForm } from '@/features/devices/components/device-form';

export function Component() {
  const navigate = useNavigate();
  const create = useCreateDevice();
  return (
    <RequireRole roles={['engineer', 'admin']}>
      <PageHeader
        eyebrow={
          <Link to={paths.devices()} className="hover:text-copper-700">
            Devices
          </Link>
        }
        title="New device"
        subtitle="What it is, what it sold for, and what its label claims. Type claims with their units as printed: 5000 mAh, 18.5 Wh, 6 h."
      />
      <DeviceForm
        submitLabel="Add device"
        onCancel={() => navigate(paths.devices())}
        onSubmit={async (values) => {
          const d = await create.mutateAsync(values);
          toast.success(`${d.maker} ${d.model} added.`);
          navigate(paths.device(d.id));
        }}
      />
    </RequireRole>
  );
}
