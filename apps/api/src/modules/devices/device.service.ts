import type { EntityManager } from '@mikro-orm/sqlite';
import type { DeviceClaimField, DeviceDto, DeviceTeardown } from '@splitcase/contracts';
import { validationError } from '../../http/errors';
import type { AuthUser } from '../../http/route';
import { parseQuantities, parseQuantity, QuantityError } from '../../lib/units';
import { FindingSchema } from '../findings/finding.entity';
import { visibleTeardowns } from '../teardowns/access';
import { TeardownSchema, type Teardown } from '../teardowns/teardown.entity';
import type { Device } from './device.entity';

type ClaimInput = Partial<Record<DeviceClaimField, string | number | null | undefined>>;

/**
 * Label claims typed with units → SI values and the text typed. Every bad field is named; none is
 * half-applied. A runtime typed as a bare number is in hours ("6" = 6 h), as on a box.
 */
export function parseClaims(body: ClaimInput): { values: Partial<Record<DeviceClaimField, number | null>>; entered: Partial<Record<DeviceClaimField, string>> } {
  const { claimRuntimeH, ...rest } = body;
  const errors: Record<string, string> = {};
  let values: Partial<Record<DeviceClaimField, number | null>> = {};
  let entered: Partial<Record<DeviceClaimField, string>> = {};
  try {
    const parsed = parseQuantities(rest, { claimCapacityAh: 'capacity', claimCapacityWh: 'energy', claimOutputWatts: 'power', claimPowerW: 'power' });
    values = parsed.values;
    entered = parsed.entered;
  } catch (err) {
    const fields = (err as { fields?: Record<string, string> }).fields;
    if (!fields) throw err;
    Object.assign(errors, fields);
  }
  if ('claimRuntimeH' in body) {
    const raw = claimRuntimeH;
    if (raw === null || raw === undefined || (typeof raw === 'string' && raw.trim() === '')) values.claimRuntimeH = null;
    else if (typeof raw === 'number' || /^\s*\d*\.?\d+\s*$/.test(raw)) values.claimRuntimeH = Number(raw);
    else {
      try {
        const q = parseQuantity(raw, 'time');
        values.claimRuntimeH = Number((q.value / 3600).toPrecision(12));
        entered.claimRuntimeH = q.entered;
      } catch (err) {
        if (!(err instanceof QuantityError)) throw err;
        errors.claimRuntimeH = 'Enter a time such as "6 h" or "90 min"';
      }
    }
  }
  for (const [key, v] of Object.entries(values)) {
    if (typeof v === 'number' && !(v > 0)) errors[key] ??= 'Must be more than zero';
  }
  if (Object.keys(errors).length) throw validationError(errors);
  return { values, entered };
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
