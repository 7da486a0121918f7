import type { ReactNode } from 'react';
import { Link } from 'react-router';
import { ChevronRight, ClipboardList } from 'lucide-react';
import type { DeviceTeardown } from '@splitcase/contracts';
import { Card, EmptyState } from '@/components/page';
import { StatusBadge } from '@/components/status';
import { paths } from '@/config/paths';
import { formatDate } from '@/lib/format';

/** The teardowns of a device, newest first; `action` is the "Start a teardown" control, when allowed. */
export function DeviceTeardowns({ teardowns, action }: { teardowns: DeviceTeardown[]; action?: ReactNode }) {
  return (
    <Card title={`Teardowns (${teardowns.length})`} actions={teardowns.length > 0 ? action : undefined}>
      {teardowns.length === 0 ? (
        <EmptyState icon={<ClipboardList className="size-8" />} message="Nobody has opened this device yet. Start a teardown to log its parts, power system and findings." action={action} />
      ) : (
        <ul className="divide-y divide-graphite-100">
          {teardowns.map((t) => (
            <li key={t.id}>
              <Link to={paths.teardown(t.id)} className="group flex items-center gap-4 px-4 py-3 hover:bg-copper-50/50">
                <div className="w-28 shrink-0 text-sm">
                  <div className="font-medium">{formatDate(t.date)}</div>
                  <div className="text-xs text-graphite-500">{t.unitLabel ?? 'Unit not named'}</div>
                </div>
                <div className="min-w-0 flex-1">
                  <div className="flex flex-wrap items-center gap-2 text-sm">
                    <StatusBadge status={t.status} />
                    <span className="text-graphite-600">by {t.engineer.name}</span>
                    <span className="text-graphite-400" aria-hidden>
                      ·
                    </span>
                    <span className="text-graphite-600">
                      {t.findingCount} finding{t.findingCount === 1 ? '' : 's'}
                    </span>
                  </div>
                  {t.summary && <p className="mt-1 line-clamp-2 text-sm text-graphite-700">{t.summary}</p>}
                </div>
                <ChevronRight className="size-4 shrink-0 text-graphite-300 group-hover:text-copper-600" aria-hidden />
              </Link>
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}
