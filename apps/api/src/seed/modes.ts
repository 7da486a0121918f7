// Operating modes of the invented demo devices: each mode lists the duty of each of the device's
// loads (in the order of the scenario's loads; 0 = off) and the quiescent current in µA.
import type { EntityManager } from '@mikro-orm/sqlite';
import type { Load } from '../modules/power/load.entity';
import { ModeLoadSchema } from '../modules/power/mode-load.entity';
import { OperatingModeSchema } from '../modules/power/mode.entity';
import type { Teardown } from '../modules/teardowns/teardown.entity';

interface DemoMode {
  name: string;
  note?: string;
  duties: number[];
  quiescentMicroAmps?: number;
}

const STANDBY = (microAmps: number, note = 'off, waiting for the button'): DemoMode => ({ name: 'Standby', note, duties: [], quiescentMicroAmps: microAmps });

/** Modes by demo device key. */
export const DEMO_MODES: Record<string, DemoMode[]> = {
  'halvix-duo': [
    { name: 'Low', note: 'one press', duties: [0.5, 0] },
    { name: 'High', note: 'button held 2 s', duties: [1, 0] },
    { name: 'Power bank', note: 'cable plugged into the USB-A port', duties: [0, 1] },
    STANDBY(20),
  ],
  'zestora-pocketsun': [{ name: 'Low', note: 'thermistor holds the plate lower', duties: [0.4] }, { name: 'High', note: 'thermistor holds the plate at its set point', duties: [0.7] }, STANDBY(15)],
  'halvix-pro': [{ name: 'Low', duties: [0.4] }, { name: 'Medium', duties: [0.6] }, { name: 'High', note: 'the highest of three levels', duties: [0.8] }, STANDBY(25)],
  'pellam-10': [{ name: 'USB-C output', note: '5 V at 3 A', duties: [1] }, STANDBY(30, 'no cable plugged in')],
  'pellam-20': [{ name: 'PD output', note: '9 V at 2.22 A to a PD sink', duties: [1] }, STANDBY(40, 'no cable plugged in')],
  'zestora-slimvolt': [{ name: 'USB-A output', note: '5 V at 1 A', duties: [1] }, STANDBY(25, 'no cable plugged in')],
  'nordwick-ridgeline': [{ name: 'Low', note: 'driver dims by PWM', duties: [0.25] }, { name: 'High', duties: [1] }, STANDBY(10)],
  'brightlark-trailbeam': [{ name: 'Low', duties: [0.3] }, { name: 'High', duties: [1] }, STANDBY(5)],
  'corvane-pocket': [{ name: 'Speed 1', duties: [0.4] }, { name: 'Speed 2', duties: [0.6] }, { name: 'Speed 3', duties: [1] }, STANDBY(10)],
  'corvane-neck': [{ name: 'Low', duties: [0.4] }, { name: 'High', duties: [0.7] }, { name: 'Boost', note: 'button held, one minute', duties: [1] }, STANDBY(12)],
};

/** The modes of one demo teardown, over the loads just created (in scenario order). */
export function seedModes(em: EntityManager, key: string, teardown: Teardown, loads: Load[]): void {
  (DEMO_MODES[key] ?? []).forEach((m, position) => {
    const mode = em.create(OperatingModeSchema, {
      teardown,
      name: m.name,
      note: m.note ?? null,
      position,
      quiescentAmps: m.quiescentMicroAmps !== undefined ? m.quiescentMicroAmps * 1e-6 : null,
      entered: m.quiescentMicroAmps !== undefined ? { quiescentAmps: `${m.quiescentMicroAmps} µA` } : null,
    });
    m.duties.forEach((duty, k) => {
      const load = loads[k];
      if (load && duty > 0) em.create(ModeLoadSchema, { mode, load, duty, entered: duty < 1 ? `${Math.round(duty * 100)} %` : null });
    });
  });
}
