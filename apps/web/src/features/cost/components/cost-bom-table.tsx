import { useMemo } from 'react';
import { CircleAlert, CircleCheck, CircleDot, Pencil } from 'lucide-react';
import { MOUNT_TYPE, PART_CATEGORY, PRICE_CONFIDENCE, PRICE_SOURCE, PRICE_VIEW_NOTE, type CostLine, type CostRollUpDto, type PriceConfidence } from '@splitcase/contracts';
import { Badge } from '@/components/badges';
import { Button } from '@/components/button';
import { DataTable, type Column } from '@/components/data-table';
import { formatDate, formatPercent } from '@/lib/format';
import { amount, plain, ratesOf } from './display';

const CONFIDENCE_BADGE: Record<PriceConfidence, { tone: 'cell' | 'amber' | 'brick'; icon: typeof CircleCheck }> = {
  high: { tone: 'cell', icon: CircleCheck },
  medium: { tone: 'amber', icon: CircleDot },
  low: { tone: 'brick', icon: CircleAlert },
};

/** The BOM at the chosen volume: prices converted to the reporting currency, sortable and filterable. */
export function CostBomTable({ cost, canEdit, editingId, onEdit }: { cost: CostRollUpDto; canEdit: boolean; editingId: number | null; onEdit: (line: CostLine) => void }) {
  const cur = cost.currency;
  // A 'totals' view (viewers) has no line prices: the table lists the lines and whether each is priced.
  const totalsOnly = cost.priceView === 'totals';
  const columns = useMemo<Column<CostLine>[]>(() => {
    const cols: Column<CostLine>[] = [
      { id: 'pos', header: '#', value: (l) => l.position, align: 'right', className: 'w-8 text-graphite-500' },
      {
        id: 'part',
        header: 'Part',
        value: (l) => [l.designators, l.description, l.makerPartNumber].filter(Boolean).join(' '),
        filter: 'text',
        cell: (l) => (
          <div className="max-w-[11.25rem] py-0.5 leading-tight">
            <div className="truncate" title={l.description}>
              {l.designators && <span className="mr-1.5 font-mono text-xs text-graphite-700">{l.designators}</span>}
              {l.description}
            </div>
            <div className="text-2xs text-graphite-500">
              {MOUNT_TYPE.labels[l.mount]}
              {l.makerPartNumber && <span className="ml-1.5 font-mono">{l.makerPartNumber}</span>}
            </div>
          </div>
        ),
      },
      { id: 'category', header: 'Category', value: (l) => PART_CATEGORY.labels[l.category], filter: 'select', className: 'text-xs leading-tight' },
      { id: 'qty', header: 'Qty', value: (l) => l.quantity, align: 'right' },
      {
        id: 'break',
        header: 'Break used',
        value: (l) => l.breakMinQty ?? undefined,
        align: 'right',
        className: 'whitespace-nowrap',
        cell: (l) => {
          const p = l.price;
          if (!p || l.breakMinQty === null) return <span className="text-graphite-400">—</span>;
          const used = p.breaks.find((b) => b.minQty === l.breakMinQty);
          return (
            <div
              title={`${l.buyQuantity.toLocaleString('en-GB')} pieces bought at this volume, attrition included${l.belowMinimumOrder ? ': below the smallest break' : ''}`}
              className={`leading-tight ${l.belowMinimumOrder ? 'text-amber-800' : ''}`}
            >
              <div>
                {used ? plain(used.unitPrice) : ''} <span className="text-xs text-graphite-500">{p.currency}</span>
              </div>
              <div className="text-2xs text-graphite-500">
                from {l.breakMinQty.toLocaleString('en-GB')} · {l.buyQuantity.toLocaleString('en-GB')} bought
                {l.belowMinimumOrder && <span className="text-amber-800"> (below)</span>}
              </div>
            </div>
          );
        },
      },
      { id: 'unit', header: `Unit ${cur}`, value: (l) => l.unitPrice ?? undefined, align: 'right', className: 'whitespace-nowrap', cell: (l) => amount(l.unitPrice) },
      {
        id: 'extended',
        header: `Extended ${cur}`,
        value: (l) => l.extended ?? undefined,
        align: 'right',
        className: 'whitespace-nowrap',
        cell: (l) =>
          l.priced ? (
            <div className="leading-tight">
              <div className="font-medium">{amount(l.extended)}</div>
              <div className="text-2xs text-graphite-500" title="Attrition of this line's category">
                +{formatPercent(l.attrition)} attrition
              </div>
            </div>
          ) : (
            <span className="text-xs text-graphite-500">not priced</span>
          ),
      },
      {
        id: 'confidence',
        header: 'Confidence',
        value: (l) => (l.price ? PRICE_CONFIDENCE.labels[l.price.confidence] : ''),
        filter: 'select',
        cell: (l) => {
          if (!l.price) return <span className="text-graphite-400">—</span>;
          const b = CONFIDENCE_BADGE[l.price.confidence];
          return (
            <Badge tone={b.tone} icon={b.icon}>
              {PRICE_CONFIDENCE.labels[l.price.confidence]}
            </Badge>
          );
        },
      },
      {
        id: 'source',
        header: 'Source',
        value: (l) => (l.price ? l.price.source : 'none'),
        filter: 'select',
        cell: (l) =>
          l.price ? (
            <div className="leading-tight whitespace-nowrap" title={`${PRICE_SOURCE.labels[l.price.source]}, ${formatDate(l.price.priceDate)}${l.price.note ? ` — ${l.price.note}` : ''}`}>
              <div className="text-xs">{l.price.source}</div>
              <div className="text-2xs text-graphite-500">{formatDate(l.price.priceDate)}</div>
            </div>
          ) : (
            <span className="text-xs text-graphite-500">No price</span>
          ),
      },
    ];
    if (totalsOnly) {
      return [
        ...cols.slice(0, 4),
        {
          id: 'priced',
          header: 'Priced',
          value: (l) => (l.priced ? 'priced' : 'not priced'),
          filter: 'select',
          cell: (l) => <span className={`text-xs ${l.priced ? '' : 'text-graphite-500'}`}>{l.priced ? 'priced' : 'not priced'}</span>,
        },
      ];
    }
    if (canEdit) {
      cols.push({
        id: 'edit',
        header: '',
        value: () => '',
        sortable: false,
        align: 'right',
        cell: (l) => (
          <Button
            size="sm"
            variant={editingId === l.partId ? 'primary' : 'quiet'}
            className="px-2"
            title={l.price ? 'Edit the price' : 'Add a price'}
            aria-label={`Edit the price of ${l.designators ?? l.description}`}
            onClick={(e) => {
              e.stopPropagation();
              onEdit(l);
            }}
          >
            <Pencil className="size-4" aria-hidden />
          </Button>
        ),
      });
    }
    return cols;
  }, [cur, canEdit, editingId, onEdit, totalsOnly]);

  return (
    <div>
      {totalsOnly ? (
        <p className="mb-1.5 text-xs text-graphite-500" data-testid="price-view-note">
          {PRICE_VIEW_NOTE}
        </p>
      ) : (
        <p className="mb-1.5 text-xs text-graphite-500">
          Unit price: the break for the pieces bought, quantity × {cost.volume.toLocaleString('en-GB')} units × (1 + attrition) rounded up, converted to {cur} at the {ratesOf(cost.rateDate)}, before
          attrition. Extended = quantity × unit price × (1 + attrition).
        </p>
      )}
      <DataTable caption="Costed bill of materials" rows={cost.lines} columns={columns} rowId={(l) => String(l.partId)} initialSort={{ id: 'pos' }} maxHeight="32rem" />
    </div>
  );
}
