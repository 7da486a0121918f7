import { NavLink } from 'react-router';
import { paths } from '@/config/paths';

const TABS = [
  { to: paths.admin.users(), label: 'Users' },
  { to: paths.admin.invitations(), label: 'Invitations' },
  { to: paths.admin.outbox(), label: 'Outbox' },
  { to: paths.admin.audit(), label: 'Audit log' },
  { to: paths.admin.figures(), label: 'Figures & safety' },
];

export function AdminTabs() {
  return (
    <nav aria-label="Admin sections" className="mb-6 flex gap-1 border-b border-graphite-150">
      {TABS.map((t) => (
        <NavLink
          key={t.to}
          to={t.to}
          className={({ isActive }) =>
            `-mb-px border-b-2 px-3 py-2 text-sm font-medium ${isActive ? 'border-copper-500 text-graphite-950' : 'border-transparent text-graphite-600 hover:text-graphite-800'}`
          }
        >
          {t.label}
        </NavLink>
      ))}
    </nav>
  );
}
