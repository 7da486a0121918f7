import { createFindingBody, findingParams, findingResponse, findingsResponse, idParam, updateFindingBody } from '@splitcase/contracts';
import { notFound } from '../../http/errors';
import { route, type RouteDef } from '../../http/route';
import { diffChanges, recordAudit } from '../audit/audit.service';
import { PartSchema } from '../parts/part.entity';
import { PhotoSchema } from '../photos/photo.entity';
import { CONTENT_EDITORS, editableTeardown } from '../teardowns/access';
import { SuggestionDecisionSchema } from '../teardowns/suggestion-decision.entity';
import { FindingSchema } from './finding.entity';
import { createFinding, FINDING_POPULATE, findingSummary, linkedRecords, toFindingDto, toLinkablePart, toLinkablePhoto } from './finding.service';
import { teardownRead } from '../teardowns/teardown-routes';

const SEVERITY_ORDER = { critical: 0, major: 1, minor: 2, note: 3 } as const;

export const findingRoutes: RouteDef[] = [
  teardownRead(
    {
      path: '/api/teardowns/:id/findings',
      tag: 'Findings',
      summary: 'Findings of a teardown, most severe first, with the parts and photos a finding may link to',
      response: findingsResponse,
    },
    async ({ em }, t) => {
      const [findings, parts, photos] = await Promise.all([
        em.find(FindingSchema, { teardown: t.id }, { populate: [...FINDING_POPULATE], orderBy: { id: 'asc' } }),
        em.find(PartSchema, { teardown: t.id }, { orderBy: { position: 'asc', id: 'asc' } }),
        em.find(PhotoSchema, { teardown: t.id }, { orderBy: { layer: 'asc', step: 'asc', id: 'asc' } }),
      ]);
      findings.sort((a, b) => SEVERITY_ORDER[a.severity] - SEVERITY_ORDER[b.severity] || a.id - b.id);
      return { findings: findings.map(toFindingDto), parts: parts.map(toLinkablePart), photos: photos.map(toLinkablePhoto) };
    },
  ),
  route(
    {
      method: 'post',
      path: '/api/teardowns/:id/findings',
      tag: 'Findings',
      summary: 'Record a finding (kind, severity, text, tags, linked parts and photos of this teardown)',
      access: CONTENT_EDITORS,
      params: idParam,
      body: createFindingBody,
      response: findingResponse,
      status: 201,
    },
    async (ctx) => {
      const { em, user, params, body } = ctx;
      const t = await editableTeardown(ctx, params.id);
      const { parts, photos } = await linkedRecords(em, t.id, body.partIds, body.photoIds);
      const finding = await em.transactional((tx) => createFinding(tx, user, t, { ...body, parts, photos }));
      await em.populate(finding, [...FINDING_POPULATE]);
      return { finding: toFindingDto(finding) };
    },
  ),
  route(
    {
      method: 'patch',
      path: '/api/teardowns/:id/findings/:findingId',
      tag: 'Findings',
      summary: 'Change a finding (any subset of the fields; partIds/photoIds replace the links)',
      access: CONTENT_EDITORS,
      params: findingParams,
      body: updateFindingBody,
      response: findingResponse,
    },
    async (ctx) => {
      const { em, user, params, body } = ctx;
      const t = await editableTeardown(ctx, params.id);
      const f = await em.findOne(FindingSchema, { id: params.findingId, teardown: t.id }, { populate: [...FINDING_POPULATE] });
      if (!f) throw notFound('The finding');
      const { parts, photos } = await linkedRecords(em, t.id, body.partIds, body.photoIds);
      const snap = () => ({
        kind: f.kind,
        severity: f.severity,
        text: f.text,
        tags: f.tags,
        partIds: f.parts
          .getItems()
          .map((p) => p.id)
          .sort((a, b) => a - b),
        photoIds: f.photos
          .getItems()
          .map((p) => p.id)
          .sort((a, b) => a - b),
      });
      const before = snap();
      if (body.kind !== undefined) f.kind = body.kind;
      if (body.severity !== undefined) f.severity = body.severity;
      if (body.text !== undefined) f.text = body.text;
      if (body.tags !== undefined) f.tags = body.tags;
      if (parts) f.parts.set(parts);
      if (photos) f.photos.set(photos);
      const changes = diffChanges(before, snap());
      if (Object.keys(changes).length) {
        recordAudit(em, user, {
          action: 'finding.updated',
          entityType: 'finding',
          entityId: f.id,
          scope: { type: 'teardown', id: t.id },
          summary: `Changed ${Object.keys(changes).join(', ')} of finding #${f.id}`,
          changes,
        });
      }
      await em.flush();
      return { finding: toFindingDto(f) };
    },
  ),
  route(
    {
      method: 'delete',
      path: '/api/teardowns/:id/findings/:findingId',
      tag: 'Findings',
      summary: 'Delete a finding (a suggestion it was accepted from becomes open again)',
      access: CONTENT_EDITORS,
      params: findingParams,
    },
    async (ctx) => {
      const { em, user, params } = ctx;
      const t = await editableTeardown(ctx, params.id);
      const f = await em.findOne(FindingSchema, { id: params.findingId, teardown: t.id });
      if (!f) throw notFound('The finding');
      await em.transactional(async (tx) => {
        await tx.nativeDelete(SuggestionDecisionSchema, { teardown: t.id, findingId: f.id });
        recordAudit(tx, user, {
          action: 'finding.deleted',
          entityType: 'finding',
          entityId: f.id,
          scope: { type: 'teardown', id: t.id },
          summary: `Deleted the ${findingSummary(f).replace(/^./, (c) => c.toLowerCase())}`,
        });
        tx.remove(f);
      });
      return undefined;
    },
  ),
];
