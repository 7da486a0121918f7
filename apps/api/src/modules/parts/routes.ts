import { createPartBody, idParam, importPartsBody, importPartsQuery, importPartsResponse, partResponse, partsResponse, reorderPartsBody, updatePartBody } from '@splitcase/contracts';
import { AppError, validationError } from '../../http/errors';
import { route, type RouteDef } from '../../http/route';
import { diffChanges, recordAudit } from '../audit/audit.service';
import { CONTENT_EDITORS, readableTeardown } from '../teardowns/access';
import { changeTeardownContent } from '../teardowns/content-change';
import { recordWrite, teardownRead, teardownWrite } from '../teardowns/teardown-routes';
import { PartSchema, type Part } from './part.entity';
import { applyPartValues, csvFileName, defaultMount, newPart, nextPosition, partSummary, partsCsv, planPartsImport, toPartDto, type PartValues } from './parts.service';

const TAG = 'Parts';
const scope = (teardownId: number) => ({ type: 'teardown', id: teardownId });
const snapshot = (p: Part): PartValues => ({
  designators: p.designators ?? null,
  category: p.category,
  description: p.description,
  marking: p.marking ?? null,
  makerPartNumber: p.makerPartNumber ?? null,
  package: p.package ?? null,
  quantity: p.quantity,
  mount: p.mount,
  notes: p.notes ?? null,
});

async function partsOf(em: Parameters<typeof readableTeardown>[0], teardownId: number): Promise<Part[]> {
  return em.find(PartSchema, { teardown: teardownId }, { orderBy: { position: 'asc', id: 'asc' } });
}

export const partRoutes: RouteDef[] = [
  teardownRead(
    {
      path: '/api/teardowns/:id/parts',
      tag: TAG,
      summary: 'The bill of materials of a teardown, in list order',
      response: partsResponse,
    },
    async ({ em, params }) => {
      return { parts: (await partsOf(em, params.id)).map(toPartDto) };
    },
  ),
  teardownRead(
    {
      path: '/api/teardowns/:id/parts.csv',
      tag: TAG,
      summary: 'The bill of materials as CSV (UTF-8 with BOM, CRLF, quoted fields, formula-safe)',
      produces: 'text/csv',
    },
    async ({ em, params, res }, t) => {
      const csv = partsCsv(await partsOf(em, params.id));
      res.setHeader('Content-Type', 'text/csv; charset=utf-8');
      res.setHeader('Content-Disposition', `attachment; filename="${csvFileName(t.device.maker, t.device.model, 'parts')}"`);
      res.setHeader('Cache-Control', 'no-store');
      res.status(200).send(csv);
    },
  ),
  teardownWrite(
    {
      method: 'post',
      path: '/api/teardowns/:id/parts',
      tag: TAG,
      summary: 'Add a part line; a resistor or capacitor marking is decoded into decodedValue (Ω or F) and decodedReadings (every reading, ranked, as the bench marking decoder)',
      body: createPartBody,
      response: partResponse,
      status: 201,
    },
    async (ctx, tx, t) => {
      const { designator, mount, ...rest } = ctx.body;
      const part = newPart(tx, t, await nextPosition(tx, t.id), {
        designators: rest.designators ?? designator ?? null,
        category: rest.category,
        description: rest.description,
        marking: rest.marking ?? null,
        makerPartNumber: rest.makerPartNumber ?? null,
        package: rest.package ?? null,
        quantity: rest.quantity,
        mount: mount ?? defaultMount(rest.category),
        notes: rest.notes ?? null,
      });
      await tx.flush();
      recordAudit(tx, ctx.user, {
        action: 'part.created',
        entityType: 'part',
        entityId: part.id,
        scope: scope(t.id),
        summary: `Added part ${partSummary(part)} ×${part.quantity}`,
      });
      return { part: toPartDto(part) };
    },
  ),
  recordWrite(
    {
      method: 'patch',
      path: '/api/parts/:id',
      tag: TAG,
      summary: 'Change a part line (the decoded value follows the marking)',
      body: updatePartBody,
      response: partResponse,
    },
    { entity: PartSchema, what: 'The part' },
    async (ctx, tx, t, part) => {
      const before = snapshot(part);
      const { designator, ...rest } = ctx.body;
      const next: Partial<PartValues> = { ...(rest as Partial<PartValues>) };
      if (designator !== undefined && rest.designators === undefined) next.designators = designator;
      applyPartValues(part, next);
      const changes = diffChanges(before as unknown as Record<string, unknown>, snapshot(part) as unknown as Record<string, unknown>);
      if (Object.keys(changes).length) {
        recordAudit(tx, ctx.user, {
          action: 'part.updated',
          entityType: 'part',
          entityId: part.id,
          scope: scope(t.id),
          summary: `Changed part ${partSummary(part)}: ${Object.keys(changes).join(', ')}`,
          changes,
        });
      }
      await tx.flush();
      return { part: toPartDto(part) };
    },
  ),
  recordWrite(
    { method: 'delete', path: '/api/parts/:id', tag: TAG, summary: 'Remove a part line (pins linked to it lose the link)' },
    { entity: PartSchema, what: 'The part' },
    async (ctx, tx, t, part) => {
      recordAudit(tx, ctx.user, {
        action: 'part.deleted',
        entityType: 'part',
        entityId: part.id,
        scope: scope(t.id),
        summary: `Removed part ${partSummary(part)}`,
        changes: Object.fromEntries(Object.entries(snapshot(part)).map(([k, v]) => [k, { from: v, to: null }])),
      });
      tx.remove(part);
    },
  ),
  teardownWrite(
    {
      method: 'put',
      path: '/api/teardowns/:id/parts/order',
      tag: TAG,
      summary: 'Put the part lines in a new order (every part id of the teardown, once)',
      body: reorderPartsBody,
      response: partsResponse,
    },
    async (ctx, tx, t) => {
      const parts = await partsOf(tx, t.id);
      const ids = ctx.body.ids;
      const known = new Set(parts.map((p) => p.id));
      if (ids.length !== parts.length || new Set(ids).size !== ids.length || ids.some((id) => !known.has(id))) {
        throw validationError({ ids: `Give each of the ${parts.length} part ids of this teardown exactly once.` });
      }
      const byId = new Map(parts.map((p) => [p.id, p]));
      ids.forEach((id, i) => (byId.get(id)!.position = i + 1));
      recordAudit(tx, ctx.user, { action: 'parts.reordered', entityType: 'teardown', entityId: t.id, scope: scope(t.id), summary: 'Reordered the parts list' });
      await tx.flush();
      return { parts: ids.map((id) => toPartDto(byId.get(id)!)) };
    },
  ),
  route(
    {
      method: 'post',
      path: '/api/teardowns/:id/parts/import',
      tag: TAG,
      summary: 'Import parts from CSV. dryRun=1 returns the preview with row-level errors and saves nothing; otherwise every row is saved in one transaction, or none (400 naming row and column)',
      access: CONTENT_EDITORS,
      params: idParam,
      query: importPartsQuery,
      body: importPartsBody,
      response: importPartsResponse,
    },
    async (ctx) => {
      const { params, query, body, em, user } = ctx;
      const plan = planPartsImport(body.csv);
      const preview = {
        delimiter: plan.delimiter,
        columns: { recognised: plan.recognised, ignored: plan.ignored },
        rows: plan.rows,
        errors: plan.errors,
        warnings: plan.warnings,
        valid: plan.errors.length === 0,
      };
      if (query.dryRun) {
        // A preview changes nothing: it needs an editor's role (route access) and a teardown they can see.
        await readableTeardown(em, user, params.id);
        return { ...preview, dryRun: true, imported: 0 };
      }
      if (plan.errors.length) {
        const fields: Record<string, string> = {};
        for (const e of plan.errors) fields[`row.${e.row}.${e.column}`] ??= e.message;
        throw new AppError(
          'validation_failed',
          `Nothing was imported: ${plan.errors.length} problem${plan.errors.length > 1 ? 's' : ''} in the file (first: row ${plan.errors[0]!.row}, ${plan.errors[0]!.column}: ${plan.errors[0]!.message})`,
          fields,
          { errors: plan.errors },
        );
      }
      const saved = await changeTeardownContent(ctx, params.id, async (tx, t) => {
        let removed = 0;
        if (body.mode === 'replace') removed = await tx.nativeDelete(PartSchema, { teardown: t.id });
        let position = await nextPosition(tx, t.id);
        const created: Part[] = [];
        for (const v of plan.values) {
          created.push(newPart(tx, t, position++, v));
        }
        await tx.flush();
        recordAudit(tx, ctx.user, {
          action: 'parts.imported',
          entityType: 'teardown',
          entityId: t.id,
          scope: scope(t.id),
          summary:
            body.mode === 'replace' ? `Replaced the parts list from CSV: ${removed} removed, ${created.length} imported` : `Imported ${created.length} part${created.length === 1 ? '' : 's'} from CSV`,
        });
        return created;
      });
      return { ...preview, dryRun: false, imported: saved.length, parts: saved.map(toPartDto) };
    },
  ),
];
