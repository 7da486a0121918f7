import { MOUNT_TYPE, PART_CATEGORY, PRICE_VIEW_NOTE, type CostRollUpDto, type PartDto, type PhotoDto } from '@splitcase/contracts';
import { DecodedMarking } from '@/components/decoded-marking';
import { formatDate, formatPercent } from '@/lib/format';
import { salesTaxText } from '@/lib/sales-tax';
import { NoneRecorded, ReportTable } from './report-layout';
import { photoNumber } from './report-photos';

/**
 * The parts list with each marking and its decoded value; with the should-cost's unit price and
 * extended price at the cost model's default volume when the cost could be worked out.
 */
export function ReportBom({ parts, photos, cost, costProblem }: { parts: PartDto[]; photos: PhotoDto[]; cost: CostRollUpDto | null; costProblem: string | null }) {
  if (!parts.length) return <NoneRecorded>No parts recorded.</NoneRecorded>;
  // Where each part is pinned: "photo 2, pin 5".
  const pins = new Map<number, string[]>();
  for (const photo of photos) {
    for (const c of photo.callouts) if (c.part) pins.set(c.part.id, [...(pins.get(c.part.id) ?? []), `photo ${photoNumber(photos, photo.id)}, pin ${c.number}`]);
  }
  const lines = new Map((cost?.lines ?? []).map((l) => [l.partId, l]));
  // The currency is named once in the column heads; amounts as the cost section shows them (4 decimals below 1).
  const money = (v: number | null | undefined) =>
    v === null || v === undefined || !Number.isFinite(v) ? '—' : v.toLocaleString('en-GB', { minimumFractionDigits: Math.abs(v) < 1 ? 4 : 2, maximumFractionDigits: Math.abs(v) < 1 ? 4 : 2 });
  const unpriced = cost ? cost.unpricedPartIds.length : 0;
  // Line prices only in a 'detail' view; a 'totals' view (viewers) keeps the parts total.
  const linePrices = cost?.priceView === 'detail';
  const head = [
    '#',
    'Designators',
    'Description',
    'Marking',
    'Value',
    'Qty',
    'Mount',
    ...(cost ? (linePrices ? [`Unit price, ${cost.currency}`, `Extended, ${cost.currency}`] : [`Cost, ${cost.currency}`]) : []),
  ];
  return (
    <div>
      <ReportTable label="Parts" head={head}>
        {parts.map((p, i) => {
          const line = lines.get(p.id);
          return (
            <tr key={p.id} data-part={p.id}>
              <td className="num text-graphite-500">{i + 1}</td>
              <td className="font-mono text-2xs text-graphite-900">{p.designators ?? '—'}</td>
              <td>
                <span className="text-graphite-950">{p.description}</span>
                <span className="block text-2xs text-graphite-500">
                  {PART_CATEGORY.labels[p.category]}
                  {p.package ? ` · ${p.package}` : ''}
                  {p.makerPartNumber ? ` · ${p.makerPartNumber}` : ''}
                  {pins.has(p.id) ? ` · ${pins.get(p.id)!.join('; ')}` : ''}
                </span>
              </td>
              <td className="font-mono text-2xs">{p.marking ?? '—'}</td>
              <td className="num whitespace-nowrap">{p.decodedReadings.length > 0 ? <DecodedMarking readings={p.decodedReadings} /> : '—'}</td>
              <td className="num text-right">{p.quantity}</td>
              <td className="whitespace-nowrap">{MOUNT_TYPE.labels[p.mount]}</td>
              {cost && linePrices && (
                <>
                  <td className="num whitespace-nowrap text-right">{line?.priced ? money(line.unitPrice) : <span className="text-graphite-500">no price</span>}</td>
                  <td className="num whitespace-nowrap text-right">{line?.priced ? money(line.extended) : '—'}</td>
                </>
              )}
              {cost && !linePrices && <td className="text-2xs text-graphite-500">{line?.priced ? 'priced' : 'no price'}</td>}
            </tr>
          );
        })}
        {cost && (
          <tr className="font-semibold break-before-avoid" data-testid="bom-total">
            <td />
            <td colSpan={6} className="text-right text-graphite-700">
              Parts at {cost.volume.toLocaleString('en-GB')} units (attrition included)
            </td>
            {linePrices && <td />}
            <td className="num whitespace-nowrap text-right text-graphite-950">{money(cost.partsTotal)}</td>
          </tr>
        )}
      </ReportTable>
      <p className="mt-1.5 text-2xs text-graphite-500">
        {cost
          ? `Prices in ${cost.currency} at ${cost.volume.toLocaleString('en-GB')} units, the cost model's default volume${cost.rateDate ? `; converted with the rates of ${formatDate(cost.rateDate)}` : ''}.${
              unpriced ? ` ${unpriced} of ${parts.length} lines have no price and add nothing to the total.` : ''
            } Should-cost figures are estimates.${linePrices ? '' : ` ${PRICE_VIEW_NOTE}`}`
          : `Prices are not shown: ${costProblem ?? 'the should-cost could not be worked out.'}`}
      </p>
      {cost && <ReportCostSummary cost={cost} money={money} />}
    </div>
  );
}

/**
 * Landed cost and the implied margin as the cost section gives them: the margin is a number only
 * when every line is priced, and names the sales tax taken out of the retail price.
 */
function ReportCostSummary({ cost, money }: { cost: CostRollUpDto; money: (v: number | null | undefined) => string }) {
  const m = cost.impliedMargin;
  const cur = cost.currency;
  return (
    <dl className="mt-2 grid grid-cols-[max-content_1fr] gap-x-4 gap-y-0.5 text-xs break-inside-avoid" data-testid="report-cost-summary">
      <dt className="text-graphite-500">Landed should-cost</dt>
      <dd className="num text-graphite-950">
        {money(cost.landed)} {cur} per unit at {cost.volume.toLocaleString('en-GB')} units (range {money(cost.low)}–{money(cost.high)} from price confidence)
      </dd>
      <dt className="text-graphite-500">Implied margin</dt>
      <dd className="text-graphite-950" data-testid="report-margin">
        {m === null ? (
          'not worked out: no retail price that can be converted'
        ) : !m.complete ? (
          <>
            <strong className="font-semibold">incomplete</strong> — {m.reason}
          </>
        ) : (
          <span className="num">
            {money(m.amount)} {cur} ({formatPercent(m.fraction)} of {money(cost.retail?.netToMaker)} {cur} net to maker)
            {cost.retail ? `, from retail ${cost.retail.seen.amount.toFixed(2)} ${cost.retail.seen.currency} ${salesTaxText(cost.retail.salesTax)}` : ''}
          </span>
        )}
      </dd>
    </dl>
  );
}
