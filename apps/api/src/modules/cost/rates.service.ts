import type { EntityManager } from '@mikro-orm/sqlite';
import type { RateTableDto, RateTableKind } from '@splitcase/contracts';
import type { AuthUser } from '../../http/route';
import { recordAudit } from '../audit/audit.service';
import { DeviceSchema } from '../devices/device.entity';
import { getSettings } from '../settings/settings.service';
import { UserSchema } from '../users/user.entity';
import { CostModelSchema } from './cost-model.entity';
import { RateTableSchema, type RateTable } from './rate-table.entity';

/** The current rate table: the latest saved. Null before any table exists. */
export async function currentRateTable(em: EntityManager): Promise<RateTable | null> {
  const [latest] = await em.find(RateTableSchema, {}, { orderBy: { id: 'desc' }, limit: 1, populate: ['createdBy'] });
  return latest ?? null;
}

export function toRateTableDto(t: RateTable, currentId: number | null): RateTableDto {
  return {
    id: t.id,
    base: t.base,
    date: t.date,
    source: t.source,
    kind: t.kind,
    rates: Object.fromEntries(Object.entries(t.rates).sort(([a], [b]) => a.localeCompare(b))),
    note: t.note ?? null,
    createdBy: t.createdBy?.name ?? null,
    createdAt: t.createdAt.toISOString(),
    current: t.id === currentId,
  };
}

export async function listRateTables(em: EntityManager, limit = 100): Promise<{ current: RateTableDto | null; history: RateTableDto[] }> {
  const rows = await em.find(RateTableSchema, {}, { orderBy: { id: 'desc' }, limit, populate: ['createdBy'] });
  const currentId = rows[0]?.id ?? null;
  const history = rows.map((r) => toRateTableDto(r, currentId));
  return { current: history[0] ?? null, history };
}

/** Whether the table can convert `code` (the base needs no rate). */
export const hasRate = (t: Pick<RateTable, 'base' | 'rates'> | null, code: string): boolean => !!t && (code === t.base || (t.rates[code] ?? 0) > 0);

/** Currencies the workspace uses now: in prices, cost models, retail prices and the reporting setting. */
export async function currenciesInUse(em: EntityManager): Promise<Map<string, string[]>> {
  const uses = new Map<string, string[]>();
  const add = (code: string | null | undefined, what: string) => {
    if (!code) return;
    const list = uses.get(code) ?? [];
    if (!list.includes(what)) list.push(what);
    uses.set(code, list);
  };
  const conn = em.getConnection();
  const priced = (await conn.execute('select currency, count(*) as n from part_prices group by currency')) as { currency: string; n: number }[];
  for (const row of priced) add(row.currency, `${row.n} part price${row.n === 1 ? '' : 's'}`);
  for (const m of await em.find(CostModelSchema, {})) add(m.model.currency, m.teardown ? 'a teardown cost model' : 'the workspace cost model');
  const retail = (await em.find(DeviceSchema, { retailCurrency: { $ne: null } }, { fields: ['retailCurrency'] })).map((d) => d.retailCurrency);
  for (const code of retail) add(code, 'device retail prices');
  add((await getSettings(em)).reportingCurrency, 'the reporting currency');
  return uses;
}

/** Warnings for currencies in use that a table cannot convert. */
export async function missingRateWarnings(em: EntityManager, table: Pick<RateTable, 'base' | 'rates' | 'date'>): Promise<string[]> {
  const warnings: string[] = [];
  for (const [code, uses] of await currenciesInUse(em)) {
    if (!hasRate(table, code)) {
      warnings.push(`${code} is used by ${uses.join(', ')} but this table (${table.base}, ${table.date}) has no ${code} rate: add one, or cost figures that need it cannot be worked out.`);
    }
  }
  return warnings;
}

/** Saves a new rate table (the old ones stay as history) with its audit entry, in one transaction. */
export async function addRateTable(
  em: EntityManager,
  user: AuthUser | null,
  input: { base: string; date: string; source: string; kind: RateTableKind; rates: Record<string, number>; note?: string | null | undefined },
  previous: RateTable | null,
): Promise<RateTable> {
  const rates = Object.fromEntries(
    Object.entries(input.rates)
      .filter(([code]) => code !== input.base)
      .sort(([a], [b]) => a.localeCompare(b)),
  );
  const changes: Record<string, { from: unknown; to: unknown }> = {};
  if (previous) {
    if (previous.base !== input.base) changes.base = { from: previous.base, to: input.base };
    if (previous.date !== input.date) changes.date = { from: previous.date, to: input.date };
    for (const code of new Set([...Object.keys(previous.rates), ...Object.keys(rates)])) {
      const from = previous.base === input.base ? (previous.rates[code] ?? null) : null;
      const to = rates[code] ?? null;
      if (from !== to) changes[code] = { from, to };
    }
  }
  return em.transactional(async (tx) => {
    const table = tx.create(RateTableSchema, {
      base: input.base,
      date: input.date,
      source: input.source,
      kind: input.kind,
      rates,
      note: input.note ?? null,
      createdBy: user ? tx.getReference(UserSchema, user.id) : null,
    });
    await tx.flush();
    recordAudit(tx, user, {
      action: input.kind === 'import' ? 'rates.imported' : 'rates.saved',
      entityType: 'rate_table',
      entityId: table.id,
      summary: `${input.kind === 'import' ? 'Imported' : 'Saved'} rates for ${input.date} (base ${input.base}, ${Object.keys(rates).length} currencies) from ${input.source}`,
      changes: previous ? changes : null,
    });
    await tx.flush();
    return table;
  });
}
