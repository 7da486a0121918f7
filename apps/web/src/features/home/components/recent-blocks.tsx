import { BookOpenCheck, Lightbulb } from 'lucide-react';
import { DEVICE_CATEGORY, type HomeResponse } from '@splitcase/contracts';
import { paths } from '@/config/paths';
import { formatDate } from '@/lib/format';
import { ActionLink, Block, EmptyLine, FindingLine, HomeTable, TeardownLink, cell } from './home-parts';

/** Everyone: the newest published teardowns. */
export function RecentPublished({ recent }: { recent: HomeResponse['recent'] }) {
  return (
    <Block id="recent-teardowns" title="Recently published" icon={<BookOpenCheck className="size-4" aria-hidden />} action={<ActionLink to={paths.devices()}>All devices</ActionLink>}>
      {recent.published.length === 0 ? (
        <EmptyLine action={<ActionLink to={paths.devices()}>Open devices</ActionLink>}>Nothing is published yet: teardowns appear here once a lead approves them.</EmptyLine>
      ) : (
        <HomeTable label="Recently published" head={['Teardown', 'Kind', 'Engineer', 'Published']}>
          {recent.published.map((t) => (
            <tr key={t.id} data-teardown={t.id}>
              <td className={cell}>
                <TeardownLink t={t} />
              </td>
              <td className={`${cell} whitespace-nowrap text-graphite-600`}>{DEVICE_CATEGORY.labels[t.device.category]}</td>
              <td className={`${cell} whitespace-nowrap text-graphite-600`}>{t.engineer.name}</td>
              <td className={`${cell} num whitespace-nowrap text-graphite-600`}>{formatDate(t.publishedAt)}</td>
            </tr>
          ))}
        </HomeTable>
      )}
    </Block>
  );
}

/** Everyone: the newest findings in teardowns the caller may read. */
export function RecentFindings({ recent }: { recent: HomeResponse['recent'] }) {
  return (
    <Block id="recent-findings" title="Recent findings" icon={<Lightbulb className="size-4" aria-hidden />}>
      {recent.findings.length === 0 ? (
        <EmptyLine action={<ActionLink to={paths.devices()}>Open devices</ActionLink>}>No findings yet: they appear here as engineers record them.</EmptyLine>
      ) : (
        <ul className="divide-y divide-graphite-100">
          {recent.findings.map((f) => (
            <FindingLine key={f.id} f={f} />
          ))}
        </ul>
      )}
    </Block>
  );
}
