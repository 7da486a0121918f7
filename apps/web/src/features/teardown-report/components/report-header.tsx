import { TriangleAlert } from 'lucide-react';
import { DEVICE_CATEGORY, TEARDOWN_STATUS, type TeardownDto } from '@splitcase/contracts';
import { Logo } from '@/components/logo';
import { StatusBadge } from '@/components/status';
import { formatDate } from '@/lib/format';
import { Facts } from './report-layout';

/** The head of the report: what was opened, by whom and when, where it stands in review, and the summary. */
export function ReportHeader({ teardown: t, printedBy, printedOn }: { teardown: TeardownDto; printedBy: string; printedOn: string }) {
  return (
    <header className="break-inside-avoid" data-section="header">
      <div className="mb-4 flex items-center justify-between gap-4 border-b border-graphite-200 pb-2">
        <Logo />
        <p className="text-xs font-medium uppercase tracking-wider text-graphite-500">Teardown report</p>
      </div>
      <p className="text-xs font-medium uppercase tracking-wider text-copper-700">{DEVICE_CATEGORY.labels[t.device.category]}</p>
      <h1 className="mt-0.5 text-2xl font-semibold tracking-tight text-graphite-950">
        {t.device.maker} {t.device.model}
      </h1>
      {t.unitLabel && <p className="text-sm text-graphite-600">{t.unitLabel}</p>}
      <div className="mt-4">
        <Facts
          items={[
            { label: 'Device', value: `${t.device.maker} ${t.device.model}` },
            { label: 'Maker', value: t.device.maker },
            { label: 'Unit', value: t.unitLabel ?? '—' },
            { label: 'Teardown date', value: <span className="num">{formatDate(t.date)}</span> },
            { label: 'Engineer', value: t.engineer.name },
            { label: 'Status', value: <StatusBadge status={t.status} /> },
            { label: 'Published', value: t.publishedAt ? <span className="num">{formatDate(t.publishedAt)}</span> : 'Not published' },
            { label: 'Printed', value: <span>{`${formatDate(printedOn)} by ${printedBy}`}</span> },
          ]}
        />
      </div>
      {t.status !== 'published' && (
        <p className="mt-4 flex items-start gap-2 rounded border border-amber-100 bg-amber-50 px-3 py-2 text-sm text-amber-800" role="note">
          <TriangleAlert className="mt-0.5 size-4 shrink-0" aria-hidden />
          {t.status === 'draft'
            ? 'Draft: not reviewed yet. Parts, figures and findings may still change.'
            : `${TEARDOWN_STATUS.labels[t.status]}: not approved yet. Parts, figures and findings may still change.`}
        </p>
      )}
      {t.summary && (
        <div className="mt-4">
          <h2 className="mb-1 text-2xs font-semibold uppercase tracking-wider text-graphite-500">Summary</h2>
          <p className="whitespace-pre-line text-sm leading-relaxed text-graphite-900">{t.summary}</p>
        </div>
      )}
    </header>
  );
}
