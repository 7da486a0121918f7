import type { EntityManager } from '@mikro-orm/sqlite';
import { DEVICE_CLAIM_QUANTITY_FIELDS, PRICE_FIELDS, type DeviceClaimField, type DeviceDto, type DeviceTeardown } from '@splitcase/contracts';
import { validationError } from '../../http/errors';
import type { AuthUser } from '../../http/route';
import { QuantityError, readPrice, readQuantity, readQuantityFields } from '../../lib/units';
import { FindingSchema } from '../findings/finding.entity';
import { visibleTeardowns } from '../teardowns/access';
import { TeardownSchema, type Teardown } from '../teardowns/teardown.entity';
import type { Device } from './device.entity';

type ClaimInput = Partial<Record<DeviceClaimField, string | number | null | undefined>>;

/**
 * Label claims typed with units → stored values (Ah, Wh, W, h) and the text typed, each field read by
 * its declaration (a bare "5000" capacity is 5000 mAh, a bare "6" runtime is 6 h, as on a box). Every
 * bad field is named; none is half-applied. A JSON number is in the stored unit (the runtime in h).
 */
export function parseClaims(body: ClaimInput): { values: Partial<Record<DeviceClaimField, number | null>>; entered: Partial<Record<DeviceClaimField, string>> } {
  const { claimRuntimeH, ...rest } = body;
  const read = readQuantityFields(rest, DEVICE_CLAIM_QUANTITY_FIELDS);
  const values: Partial<Record<DeviceClaimField, number | null>> = read.values;
  const entered: Partial<Record<DeviceClaimField, string>> = read.entered;
  const errors: Record<string, string> = { ...(read.errors as Record<string, string>) };
  if ('claimRuntimeH' in body) {
    const raw = claimRuntimeH;
    if (raw === null || raw === undefined || (typeof raw === 'string' && raw.trim() === '')) values.claimRuntimeH = null;
    else if (typeof raw === 'number') values.claimRuntimeH = raw;
    else {
      try {
        const q = readQuantity(raw, DEVICE_CLAIM_QUANTITY_FIELDS.claimRuntimeH);
        values.claimRuntimeH = Number((q.value / 3600).toPrecision(12));
        entered.claimRuntimeH = q.entered;
      } catch (err) {
        if (!(err instanceof QuantityError)) throw err;
        errors.claimRuntimeH = err.message;
      }
    }
  }
  for (const [key, v] of Object.entries(values)) {
    if (typeof v === 'number' && !(v > 0)) errors[key] ??= `${DEVICE_CLAIM_QUANTITY_FIELDS[key as DeviceClaimField].label}: must be more than zero`;
  }
  if (Object.keys(errors).length) throw validationError(errors);
  return { values, entered };
}

const MAX_RETAIL_PRICE = 10_000_000;

/**
 * The retail price as typed ("24.99", "$24.99", "24,99 €", "EUR 24.99") with the device's currency:
 * a currency typed must match the one chosen, or gives it when none is chosen; "$" alone does not
 * choose one. A price without any currency is refused, naming the currency field.
 */
export function readRetailPrice(raw: string | number | null, currency: string | null): { amount: number | null; currency: string | null } {
  if (raw === null || (typeof raw === 'string' && raw.trim() === '')) return { amount: null, currency };
  let read;
  try {
    read = readPrice(raw, PRICE_FIELDS.retailPrice, currency);
  } catch (err) {
    if (!(err instanceof QuantityError)) throw err;
    throw validationError({ retailPrice: err.message });
  }
  if (read.amount < 0) throw validationError({ retailPrice: `${PRICE_FIELDS.retailPrice.label}: must not be negative` });
  if (read.amount > MAX_RETAIL_PRICE) throw validationError({ retailPrice: `${PRICE_FIELDS.retailPrice.label}: at most ${MAX_RETAIL_PRICE}` });
  if (!read.currency) throw validationError({ currency: 'Give the currency of the price, such as USD' });
  return { amount: read.amount, currency: read.currency };
}

/** A stored double as a number (null stays null). */
export const num = (v: string | number | null | undefined): number | null => (v === null || v === undefined ? null : Number(v));

export function toDeviceDto(d: Device, teardowns: Pick<Teardown, 'id' | 'date' | 'unitLabel' | 'status' | 'createdAt'>[]): DeviceDto {
  const latest = [...teardowns].sort((a, b) => b.date.localeCompare(a.date) || b.id - a.id)[0];
  return {
    id: d.id,
    maker: d.maker,
    model: d.model,
    category: d.category,
    retailPrice: num(d.retailPrice),
    currency: d.retailCurrency ?? null,
    salesTaxRate: num(d.salesTaxRate),
    priceSeenOn: d.priceSeenOn ?? null,
    whereBought: d.whereBought ?? null,
    claimCapacityAh: num(d.claimCapacityAh),
    claimCapacityWh: num(d.claimCapacityWh),
    claimOutputWatts: num(d.claimOutputWatts),
    claimRuntimeH: num(d.claimRuntimeH),
    claimPowerW: num(d.claimPowerW),
    claimOutputText: d.claimOutputText ?? null,
    entered: (d.entered as Record<string, string> | null) ?? {},
    notes: d.notes ?? null,
    createdAt: d.createdAt.toISOString(),
    updatedAt: d.updatedAt.toISOString(),
    latestTeardown: latest ? { id: latest.id, date: latest.date, unitLabel: latest.unitLabel ?? null, status: latest.status } : null,
    teardownCount: teardowns.length,
  };
}

/** The teardowns of these devices that the user may see, grouped by device id. */
export async function visibleTeardownsByDevice(em: EntityManager, user: AuthUser, deviceIds: number[]): Promise<Map<number, Teardown[]>> {
  const out = new Map<number, Teardown[]>();
  if (deviceIds.length === 0) return out;
  const where = { ...(visibleTeardowns(user) as Record<string, unknown>), device: { $in: deviceIds } };
  const rows = await em.find(TeardownSchema, where as never, { orderBy: { date: 'desc', id: 'desc' } });
  for (const t of rows) {
    const id = typeof t.device === 'object' ? t.device.id : (t.device as number);
    out.set(id, [...(out.get(id) ?? []), t]);
  }
  return out;
}

export async function deviceTeardowns(em: EntityManager, teardowns: Teardown[]): Promise<DeviceTeardown[]> {
  const counts = new Map<number, number>();
  if (teardowns.length) {
    const findings = await em.find(FindingSchema, { teardown: { $in: teardowns.map((t) => t.id) } } as never, { fields: ['id', 'teardown'] as never });
    for (const f of findings) {
      const id = typeof f.teardown === 'object' ? f.teardown.id : (f.teardown as number);
      counts.set(id, (counts.get(id) ?? 0) + 1);
    }
  }
  await em.populate(teardowns, ['engineer']);
  return teardowns.map((t) => ({
    id: t.id,
    date: t.date,
    unitLabel: t.unitLabel ?? null,
    status: t.status,
    engineer: { id: t.engineer.id, name: t.engineer.name },
    summary: t.summary ?? null,
    findingCount: counts.get(t.id) ?? 0,
    updatedAt: t.updatedAt.toISOString(),
  }));
}
