import { DEVICE_CATEGORY, DEVICE_CLAIM_FIELDS, type DeviceClaimField, type DeviceDto } from '@splitcase/contracts';
import { Card } from '@/components/page';
import { formatDate, formatMoney } from '@/lib/format';
import { claimText } from './claims';

function Row({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="grid grid-cols-[9rem_1fr] gap-2 border-b border-graphite-100 px-4 py-2 text-sm last:border-0">
      <dt className="text-graphite-500">{label}</dt>
      <dd className="min-w-0">{children ?? <span className="text-graphite-400">—</span>}</dd>
    </div>
  );
}

/** What the device is, what it sold for, and what its label claims (as typed). */
export function DeviceFacts({ device }: { device: DeviceDto }) {
  const claims = (Object.keys(DEVICE_CLAIM_FIELDS) as DeviceClaimField[]).map((k) => [k, claimText(device, k)] as const).filter(([, v]) => v);
  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <Card title="In the shop">
        <dl>
          <Row label="Category">{DEVICE_CATEGORY.labels[device.category]}</Row>
          <Row label="Retail price">
            {device.retailPrice !== null ? (
              <span className="num">
                {formatMoney(device.retailPrice, device.currency ?? 'USD')} <span className="font-mono text-xs text-graphite-500">{device.currency}</span>
              </span>
            ) : null}
          </Row>
          {device.retailPrice !== null && (
            <Row label="Sales tax in the price">
              {device.salesTaxRate !== null ? (
                <span className="num">{device.salesTaxRate === 0 ? '0 % (quoted before tax)' : `${Number((device.salesTaxRate * 100).toPrecision(10))} %`}</span>
              ) : (
                <span className="text-graphite-600">Workspace default for {device.currency ?? 'the currency'}</span>
              )}
            </Row>
          )}
          <Row label="Price seen on">{device.priceSeenOn ? formatDate(device.priceSeenOn) : null}</Row>
          <Row label="Where bought">{device.whereBought}</Row>
          {device.notes && <Row label="Notes">{device.notes}</Row>}
        </dl>
      </Card>
      <Card title="On the label">
        {claims.length === 0 && !device.claimOutputText ? (
          <p className="px-4 py-3 text-sm text-graphite-500">No label claims recorded. Edit the device to add what the box and label promise.</p>
        ) : (
          <dl>
            {claims.map(([k, v]) => (
              <Row key={k} label={DEVICE_CLAIM_FIELDS[k].label}>
                <span className="num">{v}</span>
              </Row>
            ))}
            {device.claimOutputText && <Row label="Outputs as printed">{device.claimOutputText}</Row>}
          </dl>
        )}
      </Card>
    </div>
  );
}
