// Demo lineups: three invented comparisons over the demo devices, one of them published. Devices
// are found by their scenario keys (or by maker and model when the workspace step left no refs).
import { DEFAULT_LINEUP_WEIGHTS, type LineupMetricKey } from '@splitcase/contracts';
import { AuditEntrySchema } from '../modules/audit/audit-entry.entity';
import { DeviceSchema } from '../modules/devices/device.entity';
import { LineupDeviceSchema } from '../modules/lineups/lineup-device.entity';
import { LineupSchema } from '../modules/lineups/lineup.entity';
import { fullWeights } from '../modules/lineups/lineups.service';
import type { User } from '../modules/users/user.entity';
import type { SeedContext } from './context';
import { demoDevice, deviceRef } from './scenario';

interface DemoLineup {
  name: string;
  description: string;
  currency: string;
  devices: string[];
  weights: Partial<Record<LineupMetricKey, number>>;
  by: 'lead' | 'engineer' | 'sourcing';
  published: boolean;
  at: string;
}

export const DEMO_LINEUPS: DemoLineup[] = [
  {
    name: 'Pocket heaters, winter 2026',
    description: 'The three rival hand warmers on our bench before the winter range review (demo). Heat for the money, honest cells, and how hot they run.',
    currency: 'EUR',
    devices: ['halvix-duo', 'zestora-pocketsun', 'halvix-pro'],
    weights: { ...DEFAULT_LINEUP_WEIGHTS, heaterWPerCm2: 1, runtimeH: 2, findingsCritical: 3 },
    by: 'lead',
    published: true,
    at: '2026-11-28T10:00:00Z',
  },
  {
    name: 'Power banks under 40 USD',
    description: 'Which bank gives the most energy per dollar, and whose label holds up on the bench (demo).',
    currency: 'USD',
    devices: ['pellam-10', 'pellam-20', 'zestora-slimvolt'],
    weights: { whPerCurrency: 4, capacityVsLabel: 3, whPerKg: 1, retailPrice: 1, findingsCritical: 2, findingsMajor: 1 },
    by: 'engineer',
    published: false,
    at: '2026-11-29T14:30:00Z',
  },
  {
    name: 'Lights and fans, cost view',
    description: 'Headlamps and hand fans seen from the cost side: should-cost against shelf price (demo).',
    currency: 'GBP',
    devices: ['nordwick-ridgeline', 'brightlark-trailbeam', 'corvane-pocket', 'corvane-neck'],
    weights: { shouldCost: 2, impliedMargin: 3, retailPrice: 1, runtimeH: 1 },
    by: 'sourcing',
    published: false,
    at: '2026-11-30T09:15:00Z',
  },
];

export async function seedLineups(ctx: SeedContext): Promise<void> {
  const { em } = ctx;
  for (const demo of DEMO_LINEUPS) {
    const devices = [];
    for (const key of demo.devices) {
      const id = ctx.refs.get(deviceRef(key)) as number | undefined;
      const d = demoDevice(key);
      const device = id ? await em.findOne(DeviceSchema, { id }) : await em.findOne(DeviceSchema, { maker: d.maker, model: d.model });
      if (device) devices.push(device);
    }
    if (devices.length < 2) continue;
    const author: User = ctx.users[demo.by];
    const at = new Date(demo.at);
    const lineup = em.create(LineupSchema, {
      name: demo.name,
      description: demo.description,
      currency: demo.currency,
      weights: fullWeights(demo.weights),
      status: demo.published ? 'published' : 'draft',
      createdBy: author,
      createdAt: at,
      updatedAt: at,
      publishedAt: demo.published ? new Date(at.getTime() + 3_600_000) : null,
      publishedBy: demo.published ? ctx.users.lead : null,
    } as never);
    devices.forEach((device, k) => em.create(LineupDeviceSchema, { lineup, device, position: k + 1 } as never));
    await em.flush();
    const audit = (when: Date, actor: User, action: string, summary: string) =>
      em.create(AuditEntrySchema, { at: when, actor, action, entityType: 'lineup', entityId: String(lineup.id), scopeType: 'lineup', scopeId: String(lineup.id), summary } as never);
    audit(at, author, 'lineup.created', `Built the lineup "${demo.name}" of ${devices.length} devices in ${demo.currency}`);
    if (demo.published) audit(new Date(at.getTime() + 3_600_000), ctx.users.lead, 'lineup.published', `Changed the lineup "${demo.name}": published`);
  }
  ctx.log(`demo lineups: ${DEMO_LINEUPS.length}`);
}
