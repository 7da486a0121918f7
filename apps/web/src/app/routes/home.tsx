import { Link } from 'react-router';
import { ROLE_DESCRIPTIONS, ROLE_LABELS } from '@splitcase/contracts';
import { Card, PageHeader } from '@/components/page';
import { navFor } from '@/config/nav';
import { useMe } from '@/lib/session';

export function Component() {
  const me = useMe().data!;
  const places = navFor(me.role).filter((n) => n.to !== '/');
  return (
    <>
      <PageHeader eyebrow={ROLE_LABELS[me.role]} title={`Hello, ${me.name.split(' ')[0]}`} subtitle={ROLE_DESCRIPTIONS[me.role]} />
      <div className="grid gap-4 md:grid-cols-2 xl:grid-cols-3">
        {places.map((p) => (
          <Link key={p.to} to={p.to} className="group">
            <Card className="h-full p-4 transition-colors group-hover:border-copper-200">
              <p.icon className="mb-2 size-5 text-copper-600" aria-hidden />
              <p className="font-medium">{p.label}</p>
            </Card>
          </Link>
        ))}
      </div>
    </>
  );
}
