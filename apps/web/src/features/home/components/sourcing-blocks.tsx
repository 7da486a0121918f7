import { CircleCheck, Coins, Tags, TriangleAlert } from 'lucide-react';
import type { SourcingHome } from '@splitcase/contracts';
import { Badge } from '@/components/badges';
import { StatusBadge } from '@/components/status';
import { paths } from '@/config/paths';
import { formatDate } from '@/lib/format';
import { ActionLink, Block, EmptyLine, HomeTable, TeardownLink, cell } from './home-parts';

/** Sourcing: teardowns with parts that have no price yet, most unpriced first. */
export function SourcingMain({ data }: { data: SourcingHome }) {
  return (
    <Block id="unpriced" title="Parts without a price" icon={<Tags className="size-4" aria-hidden />} count={data.unpricedTeardowns}>
      {data.unpriced.length === 0 ? (
        <EmptyLine action={<ActionLink to={paths.devices()}>Open devices</ActionLink>}>No part is waiting for a price. New parts show up here as engineers add them.</EmptyLine>
      ) : (
        <>
          <HomeTable label="Parts without a price" head={['Teardown', 'Status', 'Unpriced', '']}>
            {data.unpriced.map((t) => (
              <tr key={t.id} data-teardown={t.id}>
                <td className={cell}>
                  <TeardownLink t={t} section="cost" />
                </td>
                <td className={cell}>
                  <StatusBadge status={t.status} />
                </td>
                <td className={`${cell} whitespace-nowrap`}>
                  <span className="num text-graphite-900" data-testid="unpriced-count">
                    {t.unpriced} of {t.parts}
                  </span>
                  <span className="ml-2 inline-block h-1.5 w-16 overflow-hidden rounded-full bg-graphite-100 align-middle" aria-hidden>
                    <span className="block h-full bg-copper-500" style={{ width: `${Math.round((t.unpriced / t.parts) * 100)}%` }} />
                  </span>
                </td>
                <td className={`${cell} text-right`}>
                  <ActionLink to={paths.teardown(t.id, 'cost')}>Price</ActionLink>
                </td>
              </tr>
            ))}
          </HomeTable>
          {data.unpricedTeardowns > data.unpriced.length && (
            <p className="border-t border-graphite-100 px-4 py-2 text-xs text-graphite-500">
              {data.unpricedTeardowns - data.unpriced.length === 1 ? '1 more teardown has' : `${data.unpricedTeardowns - data.unpriced.length} more teardowns have`} unpriced parts.
            </p>
          )}
        </>
      )}
    </Block>
  );
}

/** Sourcing: the current rate table and how old it is. */
export function SourcingSide({ data }: { data: SourcingHome }) {
  const { rates } = data;
  return (
    <Block id="rates" title="Rate table" icon={<Coins className="size-4" aria-hidden />} action={<ActionLink to={paths.rates()}>Open rates</ActionLink>}>
      {!rates ? (
        <EmptyLine action={<ActionLink to={paths.rates()}>Open rates</ActionLink>}>No rate table yet: import the reference-rate file or enter the rates by hand.</EmptyLine>
      ) : (
        <div className="space-y-1 px-4 py-3 text-sm" data-testid="rates-age">
          <div className="flex flex-wrap items-center justify-between gap-2">
            <p>
              <span className="num font-semibold text-graphite-950">{formatDate(rates.date)}</span>
              <span className="text-graphite-600"> · {rates.ageDays === 0 ? 'today' : `${rates.ageDays} day${rates.ageDays === 1 ? '' : 's'} old`}</span>
            </p>
            {rates.stale ? (
              <Badge tone="amber" icon={TriangleAlert} title={`Older than ${rates.staleAfterDays} days`}>
                Out of date
              </Badge>
            ) : (
              <Badge tone="cell" icon={CircleCheck} title={`Within ${rates.staleAfterDays} days`}>
                Current
              </Badge>
            )}
          </div>
          <p className="text-xs text-graphite-500">
            Base {rates.base} · {rates.source}
          </p>
          {rates.stale && <p className="text-xs text-amber-800">Rates older than {rates.staleAfterDays} days move every converted price: import the latest file.</p>}
        </div>
      )}
    </Block>
  );
}
