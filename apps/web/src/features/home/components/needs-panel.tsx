import { CircleCheck, Coins, Eye, Mail, PencilLine, Tags, Undo2, type LucideIcon } from 'lucide-react';
import type { HomeResponse, NeedKey, Role } from '@splitcase/contracts';
import { paths } from '@/config/paths';
import { ActionLink } from './home-parts';

const ICONS: Record<NeedKey, LucideIcon> = {
  'sent-back': Undo2,
  drafts: PencilLine,
  reviews: Eye,
  unpriced: Tags,
  rates: Coins,
  invitations: Mail,
};

/** When nothing needs the caller: one sentence and the one action, per role. */
const ALL_CLEAR: Record<Role, { text: string; action: { to: string; label: string } }> = {
  engineer: { text: 'Nothing waits on you right now.', action: { to: paths.devices(), label: 'Start a teardown' } },
  lead: { text: 'No review is waiting on you.', action: { to: paths.devices(), label: 'Compare devices' } },
  sourcing: { text: 'Every part has a price and the rates are current.', action: { to: paths.rates(), label: 'Open rates & cost model' } },
  admin: { text: 'Nothing needs you right now.', action: { to: paths.admin.audit(), label: 'Open the audit log' } },
  viewer: { text: 'Nothing needs you: the published teardowns are below.', action: { to: paths.devices(), label: 'Open devices' } },
};

/** "What needs me": a line per kind of work waiting, each jumping to its block below. */
export function NeedsPanel({ needs, role }: { needs: HomeResponse['needs']; role: Role }) {
  if (needs.total === 0) {
    const clear = ALL_CLEAR[role];
    return (
      <section aria-label="What needs you" data-testid="needs" className="flex flex-wrap items-center justify-between gap-3 rounded-lg border border-cell-100 bg-cell-50 px-4 py-3">
        <p className="flex items-center gap-2 text-sm text-cell-800">
          <CircleCheck className="size-4 shrink-0" aria-hidden />
          {clear.text}
        </p>
        <ActionLink to={clear.action.to}>{clear.action.label}</ActionLink>
      </section>
    );
  }
  return (
    <section aria-labelledby="needs-title" data-testid="needs" className="rounded-lg border border-copper-200 bg-copper-50/60 px-4 py-3">
      <h2 id="needs-title" className="text-sm font-semibold text-graphite-900">
        What needs you <span className="num ml-1 rounded-full bg-copper-600 px-1.5 py-0.5 text-xs font-semibold text-white">{needs.total}</span>
      </h2>
      <ul className="mt-2 flex flex-wrap gap-2">
        {needs.items.map((n) => {
          const Icon = ICONS[n.key];
          return (
            <li key={n.key}>
              <a
                href={`#${n.key}`}
                className="flex h-9 items-center gap-2 rounded-md border border-copper-200 bg-white px-3 text-sm text-graphite-800 hover:border-copper-400 hover:text-copper-800"
                data-need={n.key}
              >
                <Icon className="size-4 text-copper-600" aria-hidden />
                {n.label}
              </a>
            </li>
          );
        })}
      </ul>
    </section>
  );
}
