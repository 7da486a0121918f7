import { createMeasurementBody, measurementResponse, measurementsResponse, updateMeasurementBody, MEASURED_QUANTITY } from '@splitcase/contracts';

import type { RouteDef } from '../../http/route';
import { diffChanges, recordAudit } from '../audit/audit.service';
import { recordWrite, teardownRead, teardownWrite } from '../teardowns/teardown-routes';
import { UserSchema } from '../users/user.entity';
import { csvFileName } from '../parts/parts.service';
import { MeasurementSchema, type Measurement } from './measurement.entity';
import { measurementsCsv, readMeasuredValue, toMeasurementDto } from './measurements.service';

const TAG = 'Measurements';
const scope = (teardownId: number) => ({ type: 'teardown', id: teardownId });
const snapshot = (m: Measurement) => ({
  quantity: m.quantity,
  value: m.value,
  entered: m.entered,
  subject: m.subject,
  conditions: m.conditions ?? null,
  instrument: m.instrument ?? null,
  uncertainty: m.uncertainty ?? null,
});
const describe = (m: Measurement) => `${MEASURED_QUANTITY.labels[m.quantity].toLowerCase()} of ${m.subject}: ${m.entered}`;

export const measurementRoutes: RouteDef[] = [
  teardownRead({ path: '/api/teardowns/:id/measurements', tag: TAG, summary: 'Readings of a teardown, newest first', response: measurementsResponse }, async ({ em, params }) => {
    const rows = await em.find(MeasurementSchema, { teardown: params.id }, { orderBy: { takenAt: 'desc', id: 'desc' }, populate: ['takenBy'] });
    return { measurements: rows.map(toMeasurementDto) };
  }),
  teardownRead(
    {
      path: '/api/teardowns/:id/measurements.csv',
      tag: TAG,
      summary: 'Readings as CSV (UTF-8 with BOM, CRLF, quoted fields, formula-safe)',
      produces: 'text/csv',
    },
    async ({ em, params, res }, t) => {
      const rows = await em.find(MeasurementSchema, { teardown: params.id }, { orderBy: { takenAt: 'asc', id: 'asc' }, populate: ['takenBy'] });
      res.setHeader('Content-Type', 'text/csv; charset=utf-8');
      res.setHeader('Content-Disposition', `attachment; filename="${csvFileName(t.device.maker, t.device.model, 'measurements')}"`);
      res.setHeader('Cache-Control', 'no-store');
      res.status(200).send(measurementsCsv(rows));
    },
  ),
  teardownWrite(
    {
      method: 'post',
      path: '/api/teardowns/:id/measurements',
      tag: TAG,
      summary: 'Record a reading; the value is typed with its unit and read as the chosen quantity ("3.02 Ω")',
      body: createMeasurementBody,
      response: measurementResponse,
      status: 201,
    },
    async (ctx, tx, t) => {
      const { body } = ctx;
      const read = readMeasuredValue(body.quantity, body.value);
      const m = tx.create(MeasurementSchema, {
        teardown: t,
        quantity: body.quantity,
        value: read.value,
        unit: read.unit,
        entered: read.entered,
        subject: body.subject,
        conditions: body.conditions ?? null,
        instrument: body.instrument ?? null,
        uncertainty: body.uncertainty ?? null,
        takenBy: tx.getReference(UserSchema, ctx.user.id),
      } as never) as Measurement;
      await tx.flush();
      await tx.populate(m, ['takenBy']);
      recordAudit(tx, ctx.user, { action: 'measurement.created', entityType: 'measurement', entityId: m.id, scope: scope(t.id), summary: `Recorded the ${describe(m)}` });
      return { measurement: toMeasurementDto(m) };
    },
  ),
  recordWrite(
    {
      method: 'patch',
      path: '/api/measurements/:id',
      tag: TAG,
      summary: 'Correct a reading (a new quantity re-reads the value with its units)',
      body: updateMeasurementBody,
      response: measurementResponse,
    },
    { entity: MeasurementSchema, what: 'The measurement', populate: ['takenBy'] },
    async (ctx, tx, t, m) => {
      const before = snapshot(m);
      const { body } = ctx;
      if (body.quantity !== undefined || body.value !== undefined) {
        const read = readMeasuredValue(body.quantity ?? m.quantity, body.value ?? m.entered);
        m.quantity = body.quantity ?? m.quantity;
        m.value = read.value;
        m.unit = read.unit;
        m.entered = read.entered;
      }
      if (body.subject !== undefined) m.subject = body.subject;
      if (body.conditions !== undefined) m.conditions = body.conditions;
      if (body.instrument !== undefined) m.instrument = body.instrument;
      if (body.uncertainty !== undefined) m.uncertainty = body.uncertainty;
      const changes = diffChanges(before, snapshot(m));
      if (Object.keys(changes).length) {
        recordAudit(tx, ctx.user, { action: 'measurement.updated', entityType: 'measurement', entityId: m.id, scope: scope(t.id), summary: `Corrected the ${describe(m)}`, changes });
      }
      await tx.flush();
      return { measurement: toMeasurementDto(m) };
    },
  ),
  recordWrite({ method: 'delete', path: '/api/measurements/:id', tag: TAG, summary: 'Remove a reading' }, { entity: MeasurementSchema, what: 'The measurement' }, async (ctx, tx, t, m) => {
    recordAudit(tx, ctx.user, { action: 'measurement.deleted', entityType: 'measurement', entityId: m.id, scope: scope(t.id), summary: `Removed the ${describe(m)}` });
    tx.remove(m);
  }),
];
