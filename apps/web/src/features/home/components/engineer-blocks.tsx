import { Eye, PencilLine, Undo2 } from 'lucide-react';
import type { EngineerHome } from '@splitcase/contracts';
import { paths } from '@/config/paths';
import { formatDate, formatDateTime } from '@/lib/format';
import { ActionLink, Block, EmptyLine, HomeTable, TeardownLink, ago, cell } from './home-parts';

/** Engineer: sent back to me (with the reviewer's note), my drafts, my teardowns in review. */
export function EngineerMain({ data }: { data: EngineerHome }) {
  return (
    <>
      {data.sentBack.length > 0 && (
        <Block id="sent-back" title="Sent back to you" icon={<Undo2 className="size-4" aria-hidden />} count={data.sentBack.length}>
          <ul className="divide-y divide-graphite-100">
            {data.sentBack.map((t) => (
              <li key={t.id} className="space-y-1.5 px-4 py-3">
                <div className="flex flex-wrap items-baseline justify-between gap-2 text-sm">
                  <TeardownLink t={t} section="comments" />
                  <span className="text-xs text-graphite-500" title={formatDateTime(t.at)}>
                    {t.by ?? 'A reviewer'} · {ago(t.at)}
                  </span>
                </div>
                <blockquote className="border-l-2 border-amber-600 bg-amber-50 px-3 py-1.5 text-sm text-amber-800">{t.note}</blockquote>
                <ActionLink to={paths.teardown(t.id, 'comments')}>Read the comments and resubmit</ActionLink>
              </li>
            ))}
          </ul>
        </Block>
      )}
      <Block id="drafts" title="Your drafts" icon={<PencilLine className="size-4" aria-hidden />} count={data.drafts.length} action={<ActionLink to={paths.devices()}>Start another</ActionLink>}>
        {data.drafts.length === 0 ? (
          <EmptyLine action={<ActionLink to={paths.devices()}>Open devices</ActionLink>}>No drafts on your bench. Pick a device to start the next teardown.</EmptyLine>
        ) : (
          <HomeTable label="Your drafts" head={['Teardown', 'Opened', 'Last change']}>
            {data.drafts.map((t) => (
              <tr key={t.id}>
                <td className={cell}>
                  <TeardownLink t={t} />
                </td>
                <td className={`${cell} num whitespace-nowrap text-graphite-600`}>{formatDate(t.date)}</td>
                <td className={`${cell} whitespace-nowrap text-graphite-600`} title={formatDateTime(t.updatedAt)}>
                  {ago(t.updatedAt)}
                </td>
              </tr>
            ))}
          </HomeTable>
        )}
      </Block>
      <Block id="in-review" title="Yours in review" icon={<Eye className="size-4" aria-hidden />} count={data.inReview.length}>
        {data.inReview.length === 0 ? (
          <EmptyLine action={data.drafts[0] ? <ActionLink to={paths.teardown(data.drafts[0].id)}>Open your latest draft</ActionLink> : undefined}>
            None of your teardowns is with a lead. Submit a draft from its overview when its sections are in.
          </EmptyLine>
        ) : (
          <HomeTable label="Yours in review" head={['Teardown', 'Submitted']}>
            {data.inReview.map((t) => (
              <tr key={t.id}>
                <td className={cell}>
                  <TeardownLink t={t} section="comments" />
                </td>
                <td className={`${cell} whitespace-nowrap text-graphite-600`} title={formatDateTime(t.submittedAt)}>
                  {ago(t.submittedAt)}
                </td>
              </tr>
            ))}
          </HomeTable>
        )}
      </Block>
    </>
  );
}
