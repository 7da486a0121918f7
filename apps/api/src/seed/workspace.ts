import { DeviceSchema } from '../modules/devices/device.entity';
import { TeardownSchema } from '../modules/teardowns/teardown.entity';
import { UserSchema } from '../modules/users/user.entity';
import type { SeedContext } from './context';
import { DEMO_DEVICES, deviceRef, teardownRef } from './scenario';

/** Devices and one teardown each, from the invented scenario. */
export async function seedWorkspace(ctx: SeedContext): Promise<void> {
  const { em } = ctx;
  const engineer2 = await em.findOneOrFail(UserSchema, { email: 'engineer2@splitcase.test' });
  for (const d of DEMO_DEVICES) {
    const device = em.create(DeviceSchema, {
      maker: d.maker,
      model: d.model,
      category: d.category,
      retailPrice: d.retail.price,
      retailCurrency: d.retail.currency,
      priceSeenOn: d.retail.seenOn,
      whereBought: d.retail.where,
      claimCapacityAh: d.claims.capacityAh ?? null,
      claimCapacityWh: d.claims.capacityWh ?? null,
      claimOutputText: d.claims.outputText ?? null,
      claimOutputWatts: d.claims.outputWatts ?? null,
      claimRuntimeH: d.claims.runtimeH ?? null,
      claimPowerW: d.claims.powerW ?? null,
      entered: d.claims.capacityAh ? { claimCapacityAh: `${Math.round(d.claims.capacityAh * 1000)} mAh` } : null,
      notes: 'Demo device (invented).',
      createdBy: ctx.users.engineer,
    } as never);
    const reviewed = d.teardown.status !== 'draft';
    const teardown = em.create(TeardownSchema, {
      device,
      engineer: d.teardown.engineer === 'engineer' ? ctx.users.engineer : engineer2,
      unitLabel: d.teardown.unitLabel,
      date: d.teardown.date,
      status: d.teardown.status,
      summary: d.teardown.summary,
      safetyNotes: d.teardown.safetyNotes,
      submittedAt: reviewed ? new Date(`${d.teardown.date}T16:00:00Z`) : null,
      publishedAt: d.teardown.status === 'published' ? new Date(`${d.teardown.date}T18:00:00Z`) : null,
      publishedBy: d.teardown.status === 'published' ? ctx.users.lead : null,
    } as never);
    await em.flush();
    ctx.refs.set(deviceRef(d.key), device.id);
    ctx.refs.set(teardownRef(d.key), teardown.id);
  }
}
