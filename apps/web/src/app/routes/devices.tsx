import { Link } from 'react-router';
import { Plus } from 'lucide-react';
import { Button } from '@/components/button';
import { ErrorPanel } from '@/components/error-boundary';
import { PageHeader, Spinner } from '@/components/page';
import { paths } from '@/config/paths';
import { useSignedInUser } from '@/lib/session';
import { useDevices } from '@/features/devices/api/list-devices';
import { DevicesTable } from '@/features/devices/components/devices-table';

export function Component() {
  const me = useSignedInUser();
  const devices = useDevices();
  const canAdd = me.role === 'engineer' || me.role === 'admin';
  return (
    <>
      <PageHeader
        title="Devices"
        subtitle={me.role === 'viewer' ? 'Products with a published teardown.' : 'Every product the team has bought to take apart, with what its label claims and where its latest teardown stands.'}
        actions={
          canAdd && (
            <Link to={paths.newDevice()}>
              <Button variant="primary" tabIndex={-1}>
                <Plus className="size-4" aria-hidden /> New device
              </Button>
            </Link>
          )
        }
      />
      {devices.isPending ? <Spinner /> : devices.isError ? <ErrorPanel error={devices.error} onRetry={() => devices.refetch()} /> : <DevicesTable devices={devices.data} />}
    </>
  );
}
