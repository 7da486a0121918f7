import type { EntityManager } from '@mikro-orm/sqlite';
import multer from 'multer';
import {
  costModelResponse,
  costModelSchema,
  costQuery,
  costResponse,
  idParam,
  manualRatesBody,
  partPriceResponse,
  priceImportQuery,
  priceImportResponse,
  rateTableResponse,
  ratesListResponse,
  setPartPriceBody,
  teardownCostModelResponse,
  type PartPriceDto,
} from '@splitcase/contracts';
import { notFound, validationError } from '../../http/errors';
import { uploadOne } from '../../http/multipart';
import { route, type AuthUser, type RouteDef } from '../../http/route';
import { recordAudit, type Changes } from '../audit/audit.service';
import { PartSchema, type Part } from '../parts/part.entity';
import { PRICE_EDITORS, readableTeardown } from '../teardowns/access';
import { UserSchema } from '../users/user.entity';
import { clearTeardownModel, getTeardownModel, getWorkspaceModel, saveTeardownModel, saveWorkspaceModel } from './cost-model.service';
import { partName, pricedParts, teardownCost, toPartPriceDto } from './cost.service';
import { costedBomCsv, formatBreaks, readPriceCsv } from './csv';
import { readBreaksOrThrow } from './price-input';
import { parseReferenceRateXml } from './ecb';
import { PartPriceSchema, type PartPrice } from './part-price.entity';
import { RateTableSchema } from './rate-table.entity';
import { addRateTable, currentRateTable, hasRate, listRateTables, missingRateWarnings, toRateTableDto } from './rates.service';

const today = () => new Date().toISOString().slice(0, 10);
const upload = (maxBytes: number) => uploadOne({ field: 'file', maxBytes, storage: multer.memoryStorage(), fields: 4, fieldSize: 4000 });
const TAG = 'Cost';

type PriceFields = Pick<PartPriceDto, 'currency' | 'breaks' | 'source' | 'confidence' | 'priceDate' | 'note'>;
const priceFields = (p: PartPrice | null): PriceFields | null =>
  p ? { currency: p.currency, breaks: p.breaks, source: p.source, confidence: p.confidence, priceDate: p.priceDate, note: p.note ?? null } : null;

/** Human-readable before/after of a price for the history. */
function priceChanges(before: PriceFields | null, after: PriceFields | null): Changes {
  const show = (p: PriceFields | null) => (p ? `${p.currency} ${formatBreaks(p.breaks)} (${p.source}, ${p.confidence}, ${p.priceDate})` : null);
  return { price: { from: show(before), to: show(after) } };
}

/** Creates or replaces the price of a part (the caller flushes); `part` is read for its name and teardown. */
function writePrice(em: EntityManager, user: AuthUser, part: Part, existing: PartPrice | null, fields: PriceFields, how: string): PartPrice {
  const values = { ...fields, updatedBy: em.getReference(UserSchema, user.id) };
  const price = existing ? Object.assign(existing, values) : em.create(PartPriceSchema, { part: em.getReference(PartSchema, part.id), ...values });
  recordAudit(em, user, {
    action: 'price.updated',
    entityType: 'part',
    entityId: part.id,
    scope: { type: 'teardown', id: part.teardown.id },
    summary: `${how} the price of ${partName(part)}`,
    changes: priceChanges(priceFields(existing), fields),
  });
  return price;
}

async function loadPart(em: EntityManager, user: AuthUser, id: number): Promise<Part> {
  const part = await em.findOne(PartSchema, { id });
  if (!part) throw notFound('The part');
  await readableTeardown(em, user, part.teardown.id);
  return part;
}

export const costRoutes: RouteDef[] = [
  // ---- Prices ----
  route(
    {
      method: 'put',
      path: '/api/parts/:id/price',
      tag: TAG,
      summary: 'Set the price of a part: breaks (minQty → unit price) in one currency, source and confidence; the price date defaults to today',
      access: PRICE_EDITORS,
      params: idParam,
      body: setPartPriceBody,
      response: partPriceResponse,
    },
    async ({ em, user, params, body }) => {
      const part = await loadPart(em, user, params.id);
      const table = await currentRateTable(em);
      if (!hasRate(table, body.currency)) {
        throw validationError({
          currency: table
            ? `No exchange rate for ${body.currency} in the current rate table (base ${table.base}, ${table.date}). Add it on the Rates page first, or price in another currency.`
            : `There is no rate table yet, so ${body.currency} cannot be converted. Import the reference-rate file or enter rates first.`,
        });
      }
      const breaks = readBreaksOrThrow(body.breaks, body.currency);
      const existing = await em.findOne(PartPriceSchema, { part: part.id });
      const price = writePrice(
        em,
        user,
        part,
        existing,
        { currency: body.currency, breaks, source: body.source, confidence: body.confidence, priceDate: body.priceDate ?? today(), note: body.note ?? null },
        existing ? 'Changed' : 'Set',
      );
      await em.flush();
      await em.populate(price, ['updatedBy']);
      return { price: toPartPriceDto(price) };
    },
  ),
  route(
    { method: 'delete', path: '/api/parts/:id/price', tag: TAG, summary: 'Remove the price of a part (the line becomes unpriced)', access: PRICE_EDITORS, params: idParam },
    async ({ em, user, params }) => {
      const part = await loadPart(em, user, params.id);
      const existing = await em.findOne(PartPriceSchema, { part: part.id });
      if (!existing) throw notFound('A price for this part');
      recordAudit(em, user, {
        action: 'price.deleted',
        entityType: 'part',
        entityId: part.id,
        scope: { type: 'teardown', id: part.teardown.id },
        summary: `Removed the price of ${partName(part)}`,
        changes: priceChanges(priceFields(existing), null),
      });
      em.remove(existing);
      await em.flush();
      return undefined;
    },
  ),

  // ---- Rates ----
  route({ method: 'get', path: '/api/rates', tag: TAG, summary: 'The current rate table (the latest saved) and the history', access: 'signed-in', response: ratesListResponse }, async ({ em }) =>
    listRateTables(em),
  ),
  route(
    {
      method: 'put',
      path: '/api/rates',
      tag: TAG,
      summary: 'Save rates entered by hand as the new current table (units per 1 base; the history keeps the old ones)',
      access: PRICE_EDITORS,
      body: manualRatesBody,
      response: rateTableResponse,
    },
    async ({ em, user, body }) => {
      const previous = await currentRateTable(em);
      const saved = await addRateTable(em, user, { ...body, kind: 'manual' }, previous);
      const table = await em.findOneOrFail(RateTableSchema, { id: saved.id }, { populate: ['createdBy'] });
      return { rates: toRateTableDto(table, table.id), warnings: await missingRateWarnings(em, table) };
    },
  ),
  route(
    {
      method: 'post',
      path: '/api/rates/import',
      tag: TAG,
      summary: 'Import the euro reference-rate XML file (gesmes:Envelope › Cube › Cube@time › Cube@currency/@rate) as the new current table, base EUR. Admin and sourcing (sourcing owns currencies).',
      access: PRICE_EDITORS,
      multipart: { file: 'file' },
      before: [upload(5 * 1024 * 1024)],
      response: rateTableResponse,
    },
    async ({ em, user, req }) => {
      const file = req.file;
      if (!file) throw validationError({ file: 'Attach the euro reference-rate XML file in the "file" field.' });
      const parsed = parseReferenceRateXml(file.buffer);
      const previous = await currentRateTable(em);
      const name = file.originalname.replace(/[^\w.\- ]/g, '').slice(0, 80) || 'upload';
      const saved = await addRateTable(
        em,
        user,
        {
          base: parsed.base,
          date: parsed.date,
          kind: 'import',
          rates: parsed.rates,
          source: `Euro reference-rate file (${name})`,
          note: parsed.days > 1 ? `The file held ${parsed.days} days; the latest (${parsed.date}) was read.` : null,
        },
        previous,
      );
      const table = await em.findOneOrFail(RateTableSchema, { id: saved.id }, { populate: ['createdBy'] });
      return { rates: toRateTableDto(table, table.id), warnings: await missingRateWarnings(em, table) };
    },
  ),

  // ---- Cost models ----
  route({ method: 'get', path: '/api/cost-model', tag: TAG, summary: 'The workspace cost model (defaults for every teardown)', access: 'signed-in', response: costModelResponse }, async ({ em }) =>
    getWorkspaceModel(em),
  ),
  route(
    {
      method: 'put',
      path: '/api/cost-model',
      tag: TAG,
      summary: 'Change the workspace cost model',
      access: PRICE_EDITORS,
      body: costModelSchema,
      response: costModelResponse,
    },
    async ({ em, user, body }) => saveWorkspaceModel(em, user, body),
  ),
  route(
    {
      method: 'get',
      path: '/api/teardowns/:id/cost-model',
      tag: TAG,
      summary: 'The cost model a teardown is costed with (its own, or the workspace default) and the defaults',
      access: 'signed-in',
      params: idParam,
      response: teardownCostModelResponse,
    },
    async ({ em, user, params }) => getTeardownModel(em, await readableTeardown(em, user, params.id)),
  ),
  route(
    {
      method: 'put',
      path: '/api/teardowns/:id/cost-model',
      tag: TAG,
      summary: 'Give a teardown its own cost model (replaces the workspace default for it)',
      access: PRICE_EDITORS,
      params: idParam,
      body: costModelSchema,
      response: teardownCostModelResponse,
    },
    async ({ em, user, params, body }) => saveTeardownModel(em, user, await readableTeardown(em, user, params.id), body),
  ),
  route(
    {
      method: 'delete',
      path: '/api/teardowns/:id/cost-model',
      tag: TAG,
      summary: "Drop a teardown's own cost model: back to the workspace default",
      access: PRICE_EDITORS,
      params: idParam,
      response: teardownCostModelResponse,
    },
    async ({ em, user, params }) => clearTeardownModel(em, user, await readableTeardown(em, user, params.id)),
  ),

  // ---- The roll-up ----
  route(
    {
      method: 'get',
      path: '/api/teardowns/:id/cost',
      tag: TAG,
      summary:
        'Should-cost of a teardown at a volume (default: the middle volume of its cost model) in a currency (default: the reporting currency), with the rate date, each line, the steps with their inputs, the volume table and a waterfall to retail',
      access: 'signed-in',
      params: idParam,
      query: costQuery,
      response: costResponse,
      prices: 'by-role',
    },
    async ({ em, user, params, query, priceView }) => teardownCost(em, await readableTeardown(em, user, params.id), query, priceView),
  ),
  route(
    {
      method: 'get',
      path: '/api/teardowns/:id/cost.csv',
      tag: TAG,
      summary: 'The costed BOM as CSV at a volume and currency (the price import reads the same columns)',
      access: 'signed-in',
      params: idParam,
      query: costQuery,
      produces: 'text/csv',
      prices: 'by-role',
    },
    async ({ em, user, params, query, res, priceView }) => {
      const teardown = await readableTeardown(em, user, params.id);
      const cost = await teardownCost(em, teardown, query, priceView);
      const slug = `${teardown.device.maker}-${teardown.device.model}`
        .toLowerCase()
        .replace(/[^a-z0-9]+/g, '-')
        .replace(/^-|-$/g, '');
      res.setHeader('Content-Type', 'text/csv; charset=utf-8');
      res.setHeader('Content-Disposition', `attachment; filename="costed-bom-${slug}-${cost.volume}-${cost.currency}.csv"`);
      res.send(costedBomCsv(cost));
      return undefined;
    },
  ),
  route(
    {
      method: 'post',
      path: '/api/teardowns/:id/prices/import',
      tag: TAG,
      summary: 'Import prices from CSV (columns of the costed-BOM export; lines matched by designators or maker part number). mode=preview saves nothing; mode=apply saves every line or none.',
      access: PRICE_EDITORS,
      params: idParam,
      query: priceImportQuery,
      multipart: { file: 'file' },
      before: [upload(2 * 1024 * 1024)],
      response: priceImportResponse,
    },
    async ({ em, user, params, query, req }) => {
      const teardown = await readableTeardown(em, user, params.id);
      const file = req.file;
      if (!file) throw validationError({ file: 'Attach the price CSV in the "file" field.' });
      const items = await pricedParts(em, teardown.id);
      if (items.length === 0) throw validationError({ file: 'This teardown has no parts yet: add the BOM before importing prices.' });
      const table = await currentRateTable(em);
      const result = readPriceCsv(
        file.buffer.toString('utf8'),
        items.map((i) => i.part),
        { hasRate: (code) => hasRate(table, code), today: today() },
      );
      const count = Object.keys(result.errors).length;
      if (count) {
        throw validationError(result.errors, `The file has ${count === 50 ? '50 or more' : count} problem${count === 1 ? '' : 's'}; nothing was saved. ${Object.values(result.errors)[0]}`);
      }
      const existing = new Map(items.map((i) => [i.part.id, i.price]));
      const rows = result.rows.map((r) => {
        const { priceDate, note, ...rest } = r.price;
        return {
          line: r.line,
          partId: r.part.id,
          description: r.part.description,
          designators: r.part.designators ?? null,
          matchedBy: r.matchedBy,
          before: priceFields(existing.get(r.part.id) ?? null),
          after: { ...rest, priceDate, note },
        };
      });
      if (query.mode === 'apply') {
        await em.transactional(async (tx) => {
          for (const r of result.rows) {
            const current = await tx.findOne(PartPriceSchema, { part: r.part.id });
            writePrice(tx, user, r.part, current, r.price, `Imported (CSV line ${r.line})`);
          }
        });
      }
      return { mode: query.mode, rows, skipped: result.skipped, saved: query.mode === 'apply' ? rows.length : 0 };
    },
  ),
];
