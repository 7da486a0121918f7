import { Eye, TriangleAlert } from 'lucide-react';
import type { LeadHome } from '@splitcase/contracts';
import { paths } from '@/config/paths';
import { formatDate, formatDateTime } from '@/lib/format';
import { ActionLink, Block, EmptyLine, FindingLine, HomeTable, TeardownLink, ago, cell } from './home-parts';

/** Lead: teardowns waiting for review, oldest first. */
export function LeadMain({ data }: { data: LeadHome }) {
  return (
    <Block id="reviews" title="Waiting for your review" icon={<Eye className="size-4" aria-hidden />} count={data.waiting.length}>
      {data.waiting.length === 0 ? (
        <EmptyLine action={<ActionLink to={paths.devices()}>Open devices</ActionLink>}>No teardown is waiting for review. Submissions appear here, oldest first.</EmptyLine>
      ) : (
        <HomeTable label="Waiting for your review" head={['Teardown', 'Submitted by', 'Submitted', '']}>
          {data.waiting.map((t) => (
            <tr key={t.id} data-teardown={t.id}>
              <td className={cell}>
                <TeardownLink t={t} />
              </td>
              <td className={`${cell} whitespace-nowrap text-graphite-700`}>{t.submittedBy?.name ?? t.engineer.name}</td>
              <td className={`${cell} whitespace-nowrap text-graphite-600`} title={formatDateTime(t.submittedAt)}>
                <span className="num text-graphite-800">{formatDate(t.submittedAt)}</span> · {ago(t.submittedAt)}
              </td>
              <td className={`${cell} text-right`}>
                <ActionLink to={paths.teardown(t.id)}>Review</ActionLink>
              </td>
            </tr>
          ))}
        </HomeTable>
      )}
    </Block>
  );
}

/** Lead: the newest major and critical findings across teardowns. */
export function LeadSide({ data }: { data: LeadHome }) {
  return (
    <Block id="severe-findings" title="Major and critical findings" icon={<TriangleAlert className="size-4" aria-hidden />}>
      {data.severeFindings.length === 0 ? (
        <EmptyLine action={<ActionLink to={paths.devices()}>Open devices</ActionLink>}>No major or critical finding is recorded yet.</EmptyLine>
      ) : (
        <ul className="divide-y divide-graphite-100">
          {data.severeFindings.map((f) => (
            <FindingLine key={f.id} f={f} />
          ))}
        </ul>
      )}
    </Block>
  );
}
