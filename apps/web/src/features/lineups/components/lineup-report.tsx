// The printable lineup report: reads like a lab report on screen and through the browser's
// print-to-PDF (page numbers from @page in styles.css). Every figure comes from the API.
import { Fragment, lazy, Suspense, type ReactNode } from 'react';
import { DEVICE_CATEGORY, ESTIMATES_NOTE, HOT_SURFACE_CAUTION, LINEUP_STATUS, LITHIUM_CELL_CAUTION, TEARDOWN_STATUS, type ComparisonDto, type LineupDto } from '@splitcase/contracts';
import { Logo } from '@/components/logo';
import { Spinner } from '@/components/page';
import { formatDate, formatDateTime, formatMoney } from '@/lib/format';
import { betterText, coverageText, lackedMetricsText, metricHeader, metricText, modeChoiceText, rowModeText, scoreText } from './display';
import { ParetoTable } from './pareto-table';

const ParetoChart = lazy(() => import('./pareto-chart'));

function Section({ n, title, children, className = '' }: { n: number; title: string; children: ReactNode; className?: string }) {
  return (
    <section className={`mt-8 ${className}`} aria-labelledby={`report-s${n}`}>
      <h2 id={`report-s${n}`} className="mb-2 border-b border-graphite-300 pb-1 text-base font-semibold text-graphite-950 break-after-avoid">
        <span className="num mr-2 text-graphite-500">{n}</span>
        {title}
      </h2>
      {children}
    </section>
  );
}

const th = 'border-b border-graphite-300 px-1.5 py-1 text-left text-[0.7rem] font-semibold uppercase tracking-wide text-graphite-600';
const td = 'border-b border-graphite-150 px-1.5 py-1 align-top';

export function LineupReport({ lineup, comparison, printedBy }: { lineup: LineupDto; comparison: ComparisonDto; printedBy: string }) {
  const c = comparison;
  const rows = c.rows;
  const hot = rows.some((r) => r.device.category === 'pocket-heater');
  // Missing values become numbered notes, one number per distinct reason.
  const reasons: string[] = [];
  const noteOf = (reason: string) => {
    let k = reasons.indexOf(reason);
    if (k < 0) k = reasons.push(reason) - 1;
    return k + 1;
  };
  const weighted = c.metrics.filter((m) => m.applies && (c.weights[m.key] ?? 0) > 0);
  const off = c.metrics.filter((m) => m.applies && (c.weights[m.key] ?? 0) === 0);
  const deviceNotes = c.notes.filter((n) => n !== ESTIMATES_NOTE && n !== HOT_SURFACE_CAUTION);
  const dense = rows.length > 5;
  const firstIncomplete = rows.findIndex((r) => !r.complete);
  // A metric that applies to no device of the lineup (heater power density without heaters) is left out.
  const shown = c.metrics.filter((m) => m.applies);

  return (
    <article className="mx-auto max-w-[200mm] bg-white px-10 py-8 text-[0.8125rem] leading-snug text-graphite-950 shadow-card print:max-w-none print:p-0 print:shadow-none" data-testid="lineup-report">
      <header className="flex items-start justify-between gap-6 border-b-2 border-graphite-950 pb-3">
        <div className="min-w-0">
          <p className="text-xs font-medium uppercase tracking-wider text-graphite-500">Lineup report</p>
          <h1 className="mt-0.5 text-2xl font-semibold tracking-tight">{lineup.name}</h1>
          {lineup.description && <p className="mt-1 max-w-prose text-graphite-700">{lineup.description}</p>}
        </div>
        <Logo />
      </header>
      <dl className="mt-3 grid grid-cols-3 gap-x-6 gap-y-1.5 text-xs">
        <div>
          <dt className="text-graphite-500">Reporting currency</dt>
          <dd className="font-mono font-medium">{c.currency}</dd>
        </div>
        <div>
          <dt className="text-graphite-500">Rates</dt>
          <dd data-testid="report-rate-date">{c.rateTable ? `${formatDate(c.rateTable.date)} · base ${c.rateTable.base} · ${c.rateTable.source}` : 'No rate table'}</dd>
        </div>
        <div>
          <dt className="text-graphite-500">Report date</dt>
          <dd>
            {formatDateTime(c.computedAt)} · {printedBy}
          </dd>
        </div>
        <div>
          <dt className="text-graphite-500">Status</dt>
          <dd>
            {LINEUP_STATUS.labels[lineup.status]}
            {lineup.publishedAt ? `, ${formatDate(lineup.publishedAt)}${lineup.publishedBy ? ` by ${lineup.publishedBy}` : ''}` : ''}
          </dd>
        </div>
        <div>
          <dt className="text-graphite-500">Built by</dt>
          <dd>
            {lineup.createdBy?.name ?? '—'}, {formatDate(lineup.createdAt)}
          </dd>
        </div>
        <div>
          <dt className="text-graphite-500">Devices</dt>
          <dd>
            {rows.length}
            {c.hiddenDevices > 0 ? ` (${c.hiddenDevices} without a published teardown left out)` : ''}
          </dd>
        </div>
        <div className="col-span-3">
          <dt className="text-graphite-500">Operating mode compared</dt>
          <dd data-testid="report-mode">
            {modeChoiceText(c.mode)}: each device’s runtime comes from that mode of its teardown (section 1 names it); a device without recorded modes is taken at its main load.
          </dd>
        </div>
      </dl>

      <Section n={1} title="Devices and the teardowns behind the figures">
        <table className="w-full border-collapse">
          <thead>
            <tr>
              <th className={th}>Device</th>
              <th className={th}>Category</th>
              <th className={th}>Figures from</th>
              <th className={th}>Runtime from mode</th>
              <th className={`${th} text-right`}>Retail as seen</th>
              <th className={`${th} text-right`}>In {c.currency}</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr key={r.deviceId} className="break-inside-avoid">
                <td className={`${td} font-medium`}>{r.device.label}</td>
                <td className={td}>{DEVICE_CATEGORY.labels[r.device.category]}</td>
                <td className={td}>
                  {r.teardown
                    ? `Teardown #${r.teardown.id}, ${formatDate(r.teardown.date)}${r.teardown.unitLabel ? `, ${r.teardown.unitLabel}` : ''} (${TEARDOWN_STATUS.labels[r.teardown.status].toLowerCase()})`
                    : 'No teardown yet'}
                </td>
                <td className={td} data-testid="report-row-mode">
                  {r.mode ? (
                    <>
                      <span className="font-medium">{r.mode.name}</span> — {r.mode.reason}
                    </>
                  ) : (
                    <span className="text-graphite-600">{rowModeText(r)}</span>
                  )}
                </td>
                <td className={`${td} num text-right`}>
                  {r.retail ? (
                    <>
                      {formatMoney(r.retail.amount, r.retail.currency, 2)}
                      {r.retail.seenOn && <span className="block text-[0.7rem] text-graphite-500">seen {formatDate(r.retail.seenOn)}</span>}
                    </>
                  ) : (
                    '—'
                  )}
                </td>
                <td className={`${td} num text-right`}>
                  {metricText(
                    r.metrics.retailPrice,
                    c.metrics.find((m) => m.key === 'retailPrice')!,
                  )}
                  {r.retail?.rate && (
                    <span className="block text-[0.7rem] text-graphite-500">
                      × {r.retail.rate.toPrecision(4)} {c.currency}/{r.retail.currency}
                    </span>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </Section>

      <Section n={2} title="Normalised comparison">
        <table className={`w-full border-collapse ${dense ? 'text-[0.7rem]' : ''}`} aria-label="Normalised comparison, report">
          <thead>
            <tr>
              <th className={th}>Metric</th>
              {rows.map((r) => (
                <th key={r.deviceId} className={`${th} text-right normal-case tracking-normal`}>
                  {r.device.label}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {shown.map((m) => (
              <tr key={m.key} className="break-inside-avoid">
                <th scope="row" className={`${td} text-left font-medium`}>
                  {metricHeader(m)}
                  <span className="block text-[0.65rem] font-normal text-graphite-500">{betterText(m)}</span>
                </th>
                {rows.map((r) => {
                  const v = r.metrics[m.key];
                  return (
                    <td key={r.deviceId} className={`${td} num whitespace-nowrap text-right`}>
                      {v === null || v === undefined ? (
                        <span className="text-graphite-500">
                          —<sup>{noteOf(r.missing[m.key] ?? 'Not recorded.')}</sup>
                        </span>
                      ) : (
                        metricText(v, m)
                      )}
                    </td>
                  );
                })}
              </tr>
            ))}
            <tr className="break-inside-avoid font-semibold">
              <th scope="row" className={`${td} text-left`}>
                Weighted score, 0–100
              </th>
              {rows.map((r) => (
                <td key={r.deviceId} className={`${td} num text-right`}>
                  {scoreText(r.score)} <span className="font-normal text-graphite-500">(#{r.rank})</span>
                  {!r.complete && <span className="block text-[0.65rem] font-normal text-amber-800">incomplete</span>}
                </td>
              ))}
            </tr>
          </tbody>
        </table>
        {reasons.length > 0 && (
          <div className="mt-2 break-inside-avoid text-[0.7rem] text-graphite-700">
            <p className="font-medium">Missing values (“—”) are left out of the scores, never counted as zero:</p>
            <ol className="mt-0.5 space-y-0.5">
              {reasons.map((reason, k) => (
                <li key={reason}>
                  <sup>{k + 1}</sup> {reason}
                </li>
              ))}
            </ol>
          </div>
        )}
      </Section>

      <Section n={3} title={`Scatter chart: ${c.metrics.find((m) => m.key === c.pareto.x)!.label} against ${c.metrics.find((m) => m.key === c.pareto.y)!.label}`}>
        <div className="break-inside-avoid">
          {c.pareto.points.length === 0 ? (
            <p className="text-graphite-600">No device has both values: no chart.</p>
          ) : (
            <Suspense fallback={<Spinner label="Drawing the chart…" />}>
              <ParetoChart comparison={c} size={{ width: 660, height: 300 }} />
            </Suspense>
          )}
        </div>
        <div className="mt-3">
          <ParetoTable comparison={c} />
        </div>
      </Section>

      <Section n={4} title="Ranking and weights" className="break-inside-avoid">
        <div className="grid grid-cols-2 items-start gap-8">
          <table className="w-full border-collapse">
            <thead>
              <tr>
                <th className={`${th} text-right`}>Rank</th>
                <th className={th}>Device</th>
                <th className={`${th} text-right`}>Score</th>
              </tr>
            </thead>
            <tbody>
              {rows.map((r, k) => {
                const lacks = lackedMetricsText(r, c.metrics);
                return (
                  <Fragment key={r.deviceId}>
                    {k === firstIncomplete && (
                      <tr>
                        <th colSpan={3} scope="colgroup" className={`${td} pt-2 text-left text-[0.7rem] font-semibold uppercase tracking-wide text-graphite-600`}>
                          Incomplete (lacking a weighted metric): ranked after every complete device
                        </th>
                      </tr>
                    )}
                    <tr data-testid="report-ranking-row" data-complete={r.complete ? 'true' : 'false'}>
                      <td className={`${td} num text-right font-semibold`}>{r.rank}</td>
                      <td className={td}>
                        {r.device.label}
                        {lacks && <span className="block text-[0.7rem] text-amber-800">Incomplete, lacks {lacks}</span>}
                        {coverageText(r.coverage) && <span className="block text-[0.7rem] text-graphite-600">Scored {coverageText(r.coverage)}</span>}
                      </td>
                      <td className={`${td} num text-right`}>{scoreText(r.score)}</td>
                    </tr>
                  </Fragment>
                );
              })}
            </tbody>
          </table>
          <div>
            <table className="w-full border-collapse">
              <thead>
                <tr>
                  <th className={th}>Weighted metric</th>
                  <th className={`${th} text-right`}>Weight</th>
                </tr>
              </thead>
              <tbody>
                {weighted.map((m) => (
                  <tr key={m.key}>
                    <td className={td}>
                      {m.label} <span className="text-graphite-500">({betterText(m)})</span>
                    </td>
                    <td className={`${td} num text-right`}>{c.weights[m.key]}</td>
                  </tr>
                ))}
              </tbody>
            </table>
            {off.length > 0 && <p className="mt-1 text-[0.7rem] text-graphite-500">Weight 0 (not in the ranking): {off.map((m) => m.label).join(', ')}.</p>}
          </div>
        </div>
        <p className="mt-2 text-[0.7rem] text-graphite-600">
          Each weighted metric is scaled 0–1 across the lineup (min–max, 1 = best in its better direction); a device's score is the weighted mean of the metrics it has × 100, the weights renormalised
          over those [C]. A device that lacks a weighted metric is marked incomplete and ranks after every complete device, whatever its score: a missing figure is never rewarded.
        </p>
      </Section>

      <Section n={5} title="Sources of each metric">
        <table className="w-full border-collapse text-[0.7rem]">
          <thead>
            <tr>
              <th className={th}>Metric</th>
              <th className={th}>What it is</th>
              <th className={th}>Formula</th>
              <th className={th}>Source</th>
            </tr>
          </thead>
          <tbody>
            {shown.map((m) => (
              <tr key={m.key} className="break-inside-avoid">
                <td className={`${td} font-medium`}>{metricHeader(m)}</td>
                <td className={td}>{m.description}</td>
                <td className={`${td} font-mono text-[0.65rem]`}>{m.formula}</td>
                <td className={td}>{m.source}</td>
              </tr>
            ))}
          </tbody>
        </table>
        <p className="mt-2 text-[0.7rem] text-graphite-600">
          Source labels: [S] published source, [M] from memory, [CP] common practice, [C] computed from the formula. Each device's figures are those of the teardown named in section 1; money is
          converted at the rates above.
        </p>
      </Section>

      <Section n={6} title="Cautions and estimates" className="break-inside-avoid">
        <ul className="list-disc space-y-1 pl-5">
          <li>{ESTIMATES_NOTE}</li>
          {hot && <li>{HOT_SURFACE_CAUTION}</li>}
          <li>
            Lithium packs were opened and discharged at the bench for these figures. {LITHIUM_CELL_CAUTION.summary} {LITHIUM_CELL_CAUTION.defer}
          </li>
          {deviceNotes.map((n) => (
            <li key={n}>{n}</li>
          ))}
        </ul>
      </Section>
    </article>
  );
}
