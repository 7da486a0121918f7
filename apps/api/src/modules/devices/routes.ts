import type { FilterQuery } from '@mikro-orm/core';
import { createDeviceBody, DEVICE_CATEGORY, deviceDetailResponse, deviceListQuery, deviceResponse, devicesResponse, idParam, updateDeviceBody, type DeviceClaimField } from '@splitcase/contracts';
import { AppError, notFound, validationError } from '../../http/errors';
import { route, type AuthUser, type RouteDef } from '../../http/route';
import { diffChanges, recordAudit } from '../audit/audit.service';
import { CONTENT_EDITORS, DRAFT_READERS } from '../teardowns/access';
import { TeardownSchema } from '../teardowns/teardown.entity';
import { UserSchema } from '../users/user.entity';
import { DeviceSchema, type Device } from './device.entity';
import { deviceTeardowns, parseClaims, readRetailPrice, toDeviceDto, visibleTeardownsByDevice } from './device.service';

const CLAIMS: DeviceClaimField[] = ['claimCapacityAh', 'claimCapacityWh', 'claimOutputWatts', 'claimRuntimeH', 'claimPowerW'];

/** A device the user may see: viewers only see devices with a published teardown (404 otherwise). */
async function visibleDevice(em: Parameters<typeof visibleTeardownsByDevice>[0], user: AuthUser, id: number): Promise<Device> {
  const device = await em.findOne(DeviceSchema, { id });
  if (!device) throw notFound('The device');
  if (!DRAFT_READERS.includes(user.role) && (await em.count(TeardownSchema, { device: id, status: 'published' })) === 0) throw notFound('The device');
  return device;
}

function snapshot(d: Device) {
  return {
    maker: d.maker,
    model: d.model,
    category: d.category,
    retailPrice: d.retailPrice ?? null,
    currency: d.retailCurrency ?? null,
    salesTaxRate: d.salesTaxRate ?? null,
    priceSeenOn: d.priceSeenOn ?? null,
    whereBought: d.whereBought ?? null,
    claimCapacityAh: d.claimCapacityAh ?? null,
    claimCapacityWh: d.claimCapacityWh ?? null,
    claimOutputWatts: d.claimOutputWatts ?? null,
    claimRuntimeH: d.claimRuntimeH ?? null,
    claimPowerW: d.claimPowerW ?? null,
    claimOutputText: d.claimOutputText ?? null,
    notes: d.notes ?? null,
  };
}

export const deviceRoutes: RouteDef[] = [
  route(
    {
      method: 'get',
      path: '/api/devices',
      tag: 'Devices',
      summary: 'Devices with their latest teardown (viewers: devices with a published teardown only)',
      access: 'signed-in',
      query: deviceListQuery,
      response: devicesResponse,
    },
    async ({ em, user, query }) => {
      const where: FilterQuery<Device> = {};
      if (query.category) where.category = query.category;
      if (query.maker) where.maker = { $like: `%${query.maker}%` };
      if (query.q) where.$or = [{ maker: { $like: `%${query.q}%` } }, { model: { $like: `%${query.q}%` } }];
      const devices = await em.find(DeviceSchema, where, { orderBy: { maker: 'asc', model: 'asc' } });
      const byDevice = await visibleTeardownsByDevice(
        em,
        user,
        devices.map((d) => d.id),
      );
      const shown = DRAFT_READERS.includes(user.role) ? devices : devices.filter((d) => (byDevice.get(d.id) ?? []).length > 0);
      return { devices: shown.map((d) => toDeviceDto(d, byDevice.get(d.id) ?? [])) };
    },
  ),
  route(
    {
      method: 'post',
      path: '/api/devices',
      tag: 'Devices',
      summary: 'Add a device; label claims accept units ("5000 mAh", "18.5 Wh", "6 h") and keep the text typed',
      access: CONTENT_EDITORS,
      body: createDeviceBody,
      response: deviceResponse,
      status: 201,
    },
    async ({ em, user, body }) => {
      const claims = parseClaims(body);
      const price = readRetailPrice(body.retailPrice ?? null, body.currency ?? null);
      const device = await em.transactional(async (tx) => {
        const d = tx.create(DeviceSchema, {
          maker: body.maker,
          model: body.model,
          category: body.category,
          retailPrice: price.amount,
          retailCurrency: price.currency,
          salesTaxRate: body.salesTaxRate ?? null,
          priceSeenOn: body.priceSeenOn ?? null,
          whereBought: body.whereBought ?? null,
          claimOutputText: body.claimOutputText ?? null,
          ...Object.fromEntries(CLAIMS.map((k) => [k, claims.values[k] ?? null])),
          entered: Object.keys(claims.entered).length ? claims.entered : null,
          notes: body.notes ?? null,
          createdBy: tx.getReference(UserSchema, user.id),
        });
        await tx.flush();
        recordAudit(tx, user, {
          action: 'device.created',
          entityType: 'device',
          entityId: d.id,
          scope: { type: 'device', id: d.id },
          summary: `Added ${d.maker} ${d.model} (${DEVICE_CATEGORY.labels[d.category]})`,
        });
        return d;
      });
      return { device: toDeviceDto(device, []) };
    },
  ),
  route(
    {
      method: 'get',
      path: '/api/devices/:id',
      tag: 'Devices',
      summary: 'One device with the teardowns the caller may see',
      access: 'signed-in',
      params: idParam,
      response: deviceDetailResponse,
    },
    async ({ em, user, params }) => {
      const device = await visibleDevice(em, user, params.id);
      const teardowns = (await visibleTeardownsByDevice(em, user, [device.id])).get(device.id) ?? [];
      return { device: toDeviceDto(device, teardowns), teardowns: await deviceTeardowns(em, teardowns) };
    },
  ),
  route(
    {
      method: 'patch',
      path: '/api/devices/:id',
      tag: 'Devices',
      summary: 'Change a device (any subset of the fields; empty clears)',
      access: CONTENT_EDITORS,
      params: idParam,
      body: updateDeviceBody,
      response: deviceResponse,
    },
    async ({ em, user, params, body }) => {
      const device = await em.findOne(DeviceSchema, { id: params.id });
      if (!device) throw notFound('The device');
      const claimKeys = CLAIMS.filter((k) => k in body && body[k] !== undefined);
      const claims = parseClaims(Object.fromEntries(claimKeys.map((k) => [k, body[k]])));
      const currencyGiven = body.currency !== undefined ? body.currency : (device.retailCurrency ?? null);
      // A price typed again is read against the currency (given now, or kept); a kept price needs one too.
      const price =
        body.retailPrice !== undefined
          ? readRetailPrice(body.retailPrice, currencyGiven)
          : { amount: device.retailPrice === null || device.retailPrice === undefined ? null : Number(device.retailPrice), currency: currencyGiven };
      if (price.amount !== null && !price.currency) throw validationError({ currency: 'Give the currency of the price, such as USD' });
      const before = snapshot(device);
      if (body.maker !== undefined) device.maker = body.maker;
      if (body.model !== undefined) device.model = body.model;
      if (body.category !== undefined) device.category = body.category;
      if (body.retailPrice !== undefined) device.retailPrice = price.amount;
      if (body.currency !== undefined || price.currency !== (device.retailCurrency ?? null)) device.retailCurrency = price.currency;
      if (body.salesTaxRate !== undefined) device.salesTaxRate = body.salesTaxRate;
      if (body.priceSeenOn !== undefined) device.priceSeenOn = body.priceSeenOn;
      if (body.whereBought !== undefined) device.whereBought = body.whereBought;
      if (body.claimOutputText !== undefined) device.claimOutputText = body.claimOutputText;
      if (body.notes !== undefined) device.notes = body.notes;
      const entered: Record<string, string> = { ...(device.entered ?? {}) };
      for (const k of claimKeys) {
        device[k] = claims.values[k] ?? null;
        if (claims.entered[k]) entered[k] = claims.entered[k]!;
        else delete entered[k];
      }
      device.entered = Object.keys(entered).length ? entered : null;
      const changes = diffChanges(before, snapshot(device));
      if (Object.keys(changes).length) {
        recordAudit(em, user, {
          action: 'device.updated',
          entityType: 'device',
          entityId: device.id,
          scope: { type: 'device', id: device.id },
          summary: `Changed ${device.maker} ${device.model}: ${Object.keys(changes).join(', ')}`,
          changes,
        });
      }
      await em.flush();
      const teardowns = (await visibleTeardownsByDevice(em, user, [device.id])).get(device.id) ?? [];
      return { device: toDeviceDto(device, teardowns) };
    },
  ),
  route(
    {
      method: 'delete',
      path: '/api/devices/:id',
      tag: 'Devices',
      summary: 'Delete a device that has no teardown (409 otherwise)',
      access: ['admin'],
      params: idParam,
    },
    async ({ em, user, params }) => {
      const device = await em.findOne(DeviceSchema, { id: params.id });
      if (!device) throw notFound('The device');
      const n = await em.count(TeardownSchema, { device: device.id });
      if (n > 0) {
        throw new AppError('conflict', `${device.maker} ${device.model} has ${n} teardown${n === 1 ? '' : 's'}; a device with teardowns cannot be deleted.`, undefined, {
          teardowns: n,
        });
      }
      recordAudit(em, user, {
        action: 'device.deleted',
        entityType: 'device',
        entityId: device.id,
        scope: { type: 'device', id: device.id },
        summary: `Deleted ${device.maker} ${device.model}`,
      });
      em.remove(device);
      await em.flush();
      return undefined;
    },
  ),
];
