import { Inbox, Mail, Users } from 'lucide-react';
import { ROLE_LABELS, ROLES, type AdminHome } from '@splitcase/contracts';
import { Badge } from '@/components/badges';
import { paths } from '@/config/paths';
import { formatDate, formatDateTime } from '@/lib/format';
import { ActionLink, Block, EmptyLine, HomeTable, ago, cell } from './home-parts';

/** Admin: the team by role and who signed in lately, and invitations not accepted yet. */
export function AdminMain({ data }: { data: AdminHome }) {
  const active = ROLES.reduce((s, r) => s + data.usersByRole[r], 0);
  return (
    <>
      <Block id="team" title="Team" icon={<Users className="size-4" aria-hidden />} count={active} action={<ActionLink to={paths.admin.users()}>Manage users</ActionLink>}>
        <dl className="grid grid-cols-5 divide-x divide-graphite-100 border-b border-graphite-100 text-center" aria-label="Active users by role">
          {ROLES.map((r) => (
            <div key={r} className="px-2 py-2.5">
              <dt className="text-xs text-graphite-500">{ROLE_LABELS[r]}</dt>
              <dd className="num text-lg font-semibold text-graphite-950" data-role-count={r}>
                {data.usersByRole[r]}
              </dd>
            </div>
          ))}
        </dl>
        {data.recentlyActive.length === 0 ? (
          <EmptyLine action={<ActionLink to={paths.admin.users()}>Open users</ActionLink>}>No one has signed in yet.</EmptyLine>
        ) : (
          <ul className="divide-y divide-graphite-100 text-sm" aria-label="Recently active">
            {data.recentlyActive.map((u) => (
              <li key={u.id} className="flex items-center justify-between gap-3 px-4 py-1.5">
                <span className="truncate text-graphite-900">
                  {u.name} <span className="text-xs text-graphite-500">{ROLE_LABELS[u.role]}</span>
                </span>
                <span className="whitespace-nowrap text-xs text-graphite-500" title={formatDateTime(u.lastSignInAt)}>
                  signed in {ago(u.lastSignInAt)}
                </span>
              </li>
            ))}
          </ul>
        )}
        {data.inactiveUsers > 0 && <p className="border-t border-graphite-100 px-4 py-2 text-xs text-graphite-500">{data.inactiveUsers} deactivated, not counted above.</p>}
      </Block>
      <Block
        id="invitations"
        title="Invitations not accepted yet"
        icon={<Mail className="size-4" aria-hidden />}
        count={data.pendingInvitations.length}
        action={data.pendingInvitations.length > 0 ? <ActionLink to={paths.admin.invitations()}>Open invitations</ActionLink> : undefined}
      >
        {data.pendingInvitations.length === 0 ? (
          <EmptyLine action={<ActionLink to={paths.admin.invitations()}>Invite someone</ActionLink>}>No invitation is waiting. Invite a colleague by e-mail with their role.</EmptyLine>
        ) : (
          <HomeTable label="Invitations not accepted yet" head={['E-mail', 'Role', 'Invited', 'Expires']}>
            {data.pendingInvitations.map((i) => (
              <tr key={i.id}>
                <td className={`${cell} w-full max-w-0 truncate font-medium text-graphite-900`} title={i.email}>
                  {i.email}
                </td>
                <td className={cell}>
                  <Badge>{ROLE_LABELS[i.role]}</Badge>
                </td>
                <td className={`${cell} whitespace-nowrap text-graphite-600`} title={i.invitedBy ? `by ${i.invitedBy}` : undefined}>
                  {ago(i.createdAt)}
                </td>
                <td className={`${cell} num whitespace-nowrap text-graphite-600`}>{formatDate(i.expiresAt)}</td>
              </tr>
            ))}
          </HomeTable>
        )}
      </Block>
    </>
  );
}

/** Admin: the latest e-mail the capture server kept (only while it is on). */
export function AdminSide({ data }: { data: AdminHome }) {
  if (!data.outbox.enabled) return null;
  return (
    <Block id="outbox" title="Outbox" icon={<Inbox className="size-4" aria-hidden />} action={<ActionLink to={paths.admin.outbox()}>Open outbox</ActionLink>}>
      {data.outbox.messages.length === 0 ? (
        <EmptyLine>No e-mail captured yet. Invitations, resets and review requests land here while the capture server is on.</EmptyLine>
      ) : (
        <ul className="divide-y divide-graphite-100 text-sm" aria-label="Latest messages">
          {data.outbox.messages.map((m) => (
            <li key={m.id} className="px-4 py-1.5">
              <p className="truncate text-graphite-900">{m.subject}</p>
              <p className="truncate text-xs text-graphite-500">
                to {m.to} · <span title={formatDateTime(m.receivedAt)}>{ago(m.receivedAt)}</span>
              </p>
            </li>
          ))}
        </ul>
      )}
    </Block>
  );
}
