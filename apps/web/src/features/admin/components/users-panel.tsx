import { useMemo } from 'react';
import { toast } from 'sonner';
import { ROLES, ROLE_LABELS, type AdminUser, type Role } from '@splitcase/contracts';
import { CircleCheck, CircleSlash } from 'lucide-react';
import { Badge } from '@/components/badges';
import { Button } from '@/components/button';
import { DataTable, type Column } from '@/components/data-table';
import { ErrorPanel } from '@/components/error-boundary';
import { Spinner } from '@/components/page';
import { formatDateTime } from '@/lib/format';
import { useMe } from '@/lib/session';
import { useUsers } from '../api/users';
import { useUpdateUser } from '../api/update-user';

export function UsersPanel() {
  const users = useUsers();
  const me = useMe().data;
  const update = useUpdateUser();

  const change = (user: AdminUser, body: { role?: Role; active?: boolean }, done: string) =>
    update.mutate({ id: user.id, ...body }, { onSuccess: () => toast.success(done), onError: (e) => toast.error(e.message) });

  const columns = useMemo<Column<AdminUser>[]>(
    () => [
      { id: 'name', header: 'Name', value: (u) => u.name, filter: 'text', cell: (u) => <span className="font-medium">{u.name}</span> },
      { id: 'email', header: 'E-mail', value: (u) => u.email, filter: 'text', className: 'font-mono text-xs' },
      {
        id: 'role',
        header: 'Role',
        value: (u) => ROLE_LABELS[u.role],
        filter: 'select',
        cell: (u) => (
          <select
            aria-label={`Role of ${u.name}`}
            value={u.role}
            disabled={u.id === me?.id || update.isPending}
            onChange={(e) => change(u, { role: e.target.value as Role }, `${u.name} is now ${ROLE_LABELS[e.target.value as Role]}.`)}
            className="h-7 rounded border border-graphite-200 bg-white px-1 text-sm"
          >
            {ROLES.map((r) => (
              <option key={r} value={r}>
                {ROLE_LABELS[r]}
              </option>
            ))}
          </select>
        ),
      },
      {
        id: 'status',
        header: 'Status',
        value: (u) => (u.active ? 'Active' : 'Deactivated'),
        filter: 'select',
        cell: (u) =>
          u.active ? (
            <Badge tone="cell" icon={CircleCheck}>
              Active
            </Badge>
          ) : (
            <Badge tone="neutral" icon={CircleSlash}>
              Deactivated
            </Badge>
          ),
      },
      { id: 'last', header: 'Last sign-in', value: (u) => u.lastSignInAt ?? '', cell: (u) => formatDateTime(u.lastSignInAt) },
      {
        id: 'actions',
        header: '',
        value: () => '',
        sortable: false,
        align: 'right',
        cell: (u) =>
          u.id === me?.id ? (
            <span className="text-xs text-graphite-500">you</span>
          ) : u.active ? (
            <Button size="sm" variant="danger" onClick={() => change(u, { active: false }, `${u.name} is deactivated and signed out.`)}>
              Deactivate
            </Button>
          ) : (
            <Button size="sm" onClick={() => change(u, { active: true }, `${u.name} can sign in again.`)}>
              Reactivate
            </Button>
          ),
      },
    ],
    [me?.id, update.isPending],
  );

  if (users.isPending) return <Spinner />;
  if (users.isError) return <ErrorPanel error={users.error} onRetry={() => users.refetch()} />;
  return <DataTable caption="Users" rows={users.data} columns={columns} rowId={(u) => String(u.id)} initialSort={{ id: 'name' }} />;
}
