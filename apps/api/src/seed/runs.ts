// Demo bench runs, generated from simple physical models (calc's OCV-plus-resistance cell and
// first-order heater) with seeded noise, written as log files in several layouts and ingested
// through the same parser and analysis as an upload. Invented data, labelled as simulated.
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { createSeededRandom, simulateCharge, simulateDischarge, simulateHeater } from '@splitcase/calc';
import type { RunMapping, RunOptions } from '@splitcase/contracts';
import type { AuthUser } from '../http/route';
import { DeviceSchema } from '../modules/devices/device.entity';
import { ingestRun } from '../modules/runs/runs.service';
import { ensureIncomingDir, newStorageKey, removeQuietly } from '../modules/runs/storage';
import { TeardownSchema } from '../modules/teardowns/teardown.entity';
import { UserSchema } from '../modules/users/user.entity';
import type { SeedContext } from './context';
import { DEMO_DEVICES, teardownRef, type DemoDevice } from './scenario';

const DEMO = 'demo (simulated)';

/** One log: header, rows and how it is laid out. */
interface DemoLog {
  fileName: string;
  text: string;
  mapping: RunMapping;
}

/** Layouts the demo logs use, so the demo exercises the parser the way real loggers do. */
type Layout = 'csv-s' | 'csv-ms-milli' | 'tsv-s' | 'iso-semicolon-comma' | 'csv-min';

const START = Date.parse('2026-11-02T09:00:00Z');

function electricalLog(key: string, kind: RunMapping['kind'], layout: Layout, s: { t: number[]; v: number[]; i: number[] }): DemoLog {
  const n = s.t.length;
  const lines: string[] = [];
  let mapping: RunMapping;
  const base = `${key}-${kind}`;
  switch (layout) {
    case 'csv-ms-milli':
      lines.push('time_ms,vbat_mV,ibat_mA');
      for (let k = 0; k < n; k++) lines.push(`${Math.round(s.t[k]! * 1000)},${(s.v[k]! * 1000).toFixed(1)},${(s.i[k]! * 1000).toFixed(1)}`);
      mapping = { kind, time: { column: 'time_ms', unit: 'ms' }, voltage: { column: 'vbat_mV', unit: 'mV' }, current: { column: 'ibat_mA', unit: 'mA' } };
      return { fileName: `${base}.csv`, text: lines.join('\n') + '\n', mapping };
    case 'tsv-s':
      lines.push('Elapsed (s)\tVoltage (V)\tCurrent (A)\tPower (W)');
      for (let k = 0; k < n; k++) lines.push(`${s.t[k]!.toFixed(1)}\t${s.v[k]!.toFixed(4)}\t${s.i[k]!.toFixed(4)}\t${(s.v[k]! * s.i[k]!).toFixed(4)}`);
      mapping = {
        kind,
        time: { column: 'Elapsed (s)', unit: 's' },
        voltage: { column: 'Voltage (V)', unit: 'V' },
        current: { column: 'Current (A)', unit: 'A' },
        power: { column: 'Power (W)', unit: 'W' },
        delimiter: '\t',
      };
      return { fileName: `${base}.tsv`, text: lines.join('\n') + '\n', mapping };
    case 'iso-semicolon-comma':
      // A logger with a preamble, ISO timestamps, semicolons and decimal commas.
      lines.push('# Bench logger export (demo)', `# Device: ${key}`, 'timestamp;voltage;current');
      for (let k = 0; k < n; k++) {
        const iso = new Date(START + Math.round(s.t[k]! * 1000)).toISOString();
        lines.push(`${iso};${s.v[k]!.toFixed(4).replace('.', ',')};${s.i[k]!.toFixed(4).replace('.', ',')}`);
      }
      mapping = {
        kind,
        time: { column: 'timestamp', unit: 'iso' },
        voltage: { column: 'voltage', unit: 'V' },
        current: { column: 'current', unit: 'A' },
        delimiter: ';',
        decimalComma: true,
        headerRow: 3,
      };
      return { fileName: `${base}.csv`, text: lines.join('\n') + '\n', mapping };
    case 'csv-min':
      lines.push('time_min,volts,amps');
      for (let k = 0; k < n; k++) lines.push(`${(s.t[k]! / 60).toFixed(4)},${s.v[k]!.toFixed(4)},${s.i[k]!.toFixed(4)}`);
      mapping = { kind, time: { column: 'time_min', unit: 'min' }, voltage: { column: 'volts', unit: 'V' }, current: { column: 'amps', unit: 'A' } };
      return { fileName: `${base}.csv`, text: lines.join('\n') + '\n', mapping };
    default:
      lines.push('elapsed_s,voltage_V,current_A');
      for (let k = 0; k < n; k++) lines.push(`${s.t[k]!.toFixed(1)},${s.v[k]!.toFixed(4)},${s.i[k]!.toFixed(4)}`);
      mapping = { kind, time: { column: 'elapsed_s', unit: 's' }, voltage: { column: 'voltage_V', unit: 'V' }, current: { column: 'current_A', unit: 'A' } };
      return { fileName: `${base}.csv`, text: lines.join('\n') + '\n', mapping };
  }
}

const DISCHARGE_LAYOUT: Record<string, Layout> = {
  'halvix-duo': 'csv-ms-milli',
  'pellam-10': 'tsv-s',
  'zestora-slimvolt': 'iso-semicolon-comma',
  'nordwick-ridgeline': 'csv-min',
};

/** Devices with a demo charge log, and its layout. */
const CHARGE_LAYOUT: Record<string, Layout> = {
  'halvix-duo': 'csv-s',
  'pellam-10': 'csv-ms-milli',
  'zestora-slimvolt': 'csv-s',
  'nordwick-ridgeline': 'tsv-s',
};

/** Heater surface in the demo: settled temperature, time constant and the surface touched (invented, per the scenario's notes). */
const HEATERS: Record<string, { plateauC: number; tauS: number; material: 'metal' | 'plastic'; fahrenheit?: boolean }> = {
  // "Heater surface reached 55 °C on the highest level within 10 minutes at 25 °C ambient."
  'halvix-duo': { plateauC: 55, tauS: 150, material: 'metal' },
  // NTC on the aluminium plate: regulated lower; this logger writes °F.
  'zestora-pocketsun': { plateauC: 44, tauS: 200, material: 'metal', fahrenheit: true },
  'halvix-pro': { plateauC: 47, tauS: 180, material: 'plastic' },
};

/** Seed per device so every device has its own reproducible noise. */
const seedOf = (key: string, salt: number) => {
  let h = salt >>> 0;
  for (const ch of key) h = Math.imul(h ^ ch.charCodeAt(0), 16777619) >>> 0;
  return h;
};

/**
 * Devices whose demo discharge includes a DC-resistance pulse (REFERENCES §12: 0.2 It, then 1.0 It
 * for 1 s), at this share of the run; the logger records every 0.5 s around it.
 */
const RESISTANCE_PULSE: Record<string, number> = { 'halvix-duo': 0.5, 'pellam-10': 0.4 };

function dischargeLog(d: DemoDevice): { log: DemoLog; options: RunOptions; label: string } {
  const c = d.design.cells;
  const ratedAh = c.ratedAh * c.parallel;
  const currentA = 0.2 * ratedAh; // 0.2 C, the rated-capacity discharge of IEC 61960-3 [M]
  const share = RESISTANCE_PULSE[d.key];
  // The run lasts about measured Ah ÷ current hours; the pulse starts on a whole 20 s sample.
  const pulseAtS = share === undefined ? undefined : Math.round((share * ((c.measuredAh * c.parallel) / currentA) * 3600) / 20) * 20;
  const { series } = simulateDischarge({
    capacityAh: c.measuredAh * c.parallel,
    currentA,
    internalResistanceOhm: 0.06 / c.parallel,
    cutoffVolts: 3.0,
    stepS: 20,
    noise: { seed: seedOf(d.key, 1), voltsSd: 0.002, ampsSd: currentA * 0.002 },
    ...(pulseAtS === undefined ? {} : { pulse: { atS: pulseAtS, currentA: ratedAh, durationS: 1 } }),
  });
  return {
    log: electricalLog(d.key, 'discharge', DISCHARGE_LAYOUT[d.key] ?? 'csv-s', series),
    options: { cutoffVolts: 3.0 },
    label: `Discharge at 0.2 C (${currentA.toFixed(2)} A) to 3.0 V${pulseAtS === undefined ? '' : ', with a 1 C pulse for 1 s'} — ${DEMO}`,
  };
}

function chargeLog(d: DemoDevice): { log: DemoLog; options: RunOptions; label: string } | null {
  const layout = CHARGE_LAYOUT[d.key];
  const charger = d.design.converters.find((x) => x.role === 'charge');
  if (!layout || !charger?.chargeA) return null;
  const c = d.design.cells;
  const { series } = simulateCharge({
    capacityAh: c.measuredAh * c.parallel,
    ccCurrentA: charger.chargeA,
    cvVolts: 4.2,
    // The charger stops a little under C/20 of the rated capacity so the logged (noisy) current
    // crosses the analysis' default termination of 0.05 C.
    terminationA: 0.045 * c.ratedAh * c.parallel,
    internalResistanceOhm: 0.08 / c.parallel,
    stepS: 15,
    initialSoc: 0.02,
    noise: { seed: seedOf(d.key, 2), voltsSd: 0.0015, ampsSd: charger.chargeA * 0.002 },
  });
  return {
    log: electricalLog(d.key, 'charge', layout, series),
    options: { cvVolts: 4.2 },
    label: `CC-CV charge at ${charger.chargeA} A from empty — ${DEMO}`,
  };
}

function thermalLog(d: DemoDevice): { log: DemoLog; options: RunOptions; label: string } | null {
  const h = HEATERS[d.key];
  const heaters = d.design.loads.filter((l) => l.kind === 'heater' && l.ohms);
  if (!h || heaters.length === 0) return null;
  // Element power at the cell's nominal voltage, V²/R per element × count × duty [C].
  const watts = heaters.reduce((sum, l) => sum + (d.design.cells.nominalV ** 2 / l.ohms!) * l.count * l.duty, 0);
  const ambientC = 25;
  const { series } = simulateHeater({
    watts,
    tauS: h.tauS,
    rthKPerW: (h.plateauC - ambientC) / watts,
    ambientC,
    durationS: 45 * 60,
    stepS: 3,
    noise: { seed: seedOf(d.key, 3), tempSd: 0.12 },
  });
  const lines: string[] = [];
  let mapping: RunMapping;
  if (h.fahrenheit) {
    lines.push('seconds,surface_F,heater_W');
    for (let k = 0; k < series.t.length; k++) lines.push(`${series.t[k]},${(series.temp[k]! * 1.8 + 32).toFixed(2)},${series.p[k]!.toFixed(3)}`);
    mapping = { kind: 'thermal', time: { column: 'seconds', unit: 's' }, temperature: { column: 'surface_F', unit: '°F' }, power: { column: 'heater_W', unit: 'W' } };
  } else {
    lines.push('t_s,TC1 surface (°C),P (W)');
    for (let k = 0; k < series.t.length; k++) lines.push(`${series.t[k]},${series.temp[k]!.toFixed(2)},${series.p[k]!.toFixed(3)}`);
    mapping = { kind: 'thermal', time: { column: 't_s', unit: 's' }, temperature: { column: 'TC1 surface (°C)', unit: '°C' }, power: { column: 'P (W)', unit: 'W' } };
  }
  return {
    log: { fileName: `${d.key}-thermal.csv`, text: lines.join('\n') + '\n', mapping },
    options: { material: h.material, contactSeconds: 600, thresholdC: 45 },
    label: `Surface on the highest level, ${ambientC} °C ambient — ${DEMO}`,
  };
}

function powerBankLog(d: DemoDevice): { log: DemoLog; options: RunOptions; label: string } | null {
  if (d.category !== 'power-bank') return null;
  const output = d.design.converters.find((x) => x.role === 'output');
  const load = d.design.loads.find((l) => l.kind === 'usb-output');
  if (!output || !load?.amps) return null;
  const c = d.design.cells;
  const cellWh = c.measuredAh * c.parallel * c.nominalV;
  const outWh = cellWh * output.efficiency;
  const volts = output.vout;
  const amps = load.amps;
  const stepS = 15;
  const seconds = (outWh / (volts * amps)) * 3600;
  const n = Math.ceil(seconds / stepS);
  const rand = createSeededRandom(seedOf(d.key, 4));
  const normal = () => Math.sqrt(-2 * Math.log(1 - rand())) * Math.cos(2 * Math.PI * rand());
  const s = { t: [] as number[], v: [] as number[], i: [] as number[] };
  for (let k = 0; k <= n + 12; k++) {
    const on = k <= n;
    s.t.push(k * stepS);
    // Output held by the boost stage, a little cable drop under load; the bank switches off when empty.
    s.v.push((on ? volts - 0.04 * amps - 0.02 * (k / n) : volts + 0.05) + 0.004 * normal());
    s.i.push(on ? amps + 0.003 * normal() : 0);
  }
  return {
    log: electricalLog(d.key, 'power-bank', 'csv-s', s),
    options: {},
    label: `USB output at ${volts} V ${amps} A until shut-off — ${DEMO}`,
  };
}

export async function seedRuns(ctx: SeedContext): Promise<void> {
  const { em, env } = ctx;
  const incoming = ensureIncomingDir(env.uploadsDir);
  const engineer2 = await em.findOne(UserSchema, { email: 'engineer2@splitcase.test' });
  for (const d of DEMO_DEVICES) {
    const ref = ctx.refs.get(teardownRef(d.key)) as number | undefined;
    const teardown = ref
      ? await em.findOneOrFail(TeardownSchema, { id: ref }, { populate: ['device'] })
      : await em.findOne(TeardownSchema, { device: await em.findOneOrFail(DeviceSchema, { maker: d.maker, model: d.model }) }, { populate: ['device'] });
    if (!teardown) continue;
    const owner = d.teardown.engineer === 'engineer2' && engineer2 ? engineer2 : ctx.users.engineer;
    const user: AuthUser = { id: owner.id, email: owner.email, name: owner.name, role: owner.role };
    const logs = [dischargeLog(d), chargeLog(d), thermalLog(d), powerBankLog(d)].filter((x) => x !== null);
    for (const { log, options, label } of logs) {
      const path = join(incoming, `${newStorageKey()}.part`);
      writeFileSync(path, log.text);
      try {
        await ingestRun(em, env, {
          teardown,
          user,
          incomingPath: path,
          originalName: log.fileName,
          fileBytes: Buffer.byteLength(log.text),
          mapping: log.mapping,
          label,
          options,
        });
      } finally {
        removeQuietly(path);
      }
    }
  }
}
