// Demo seed: parts lists, power systems and bench readings for every demo teardown, derived from
// the invented design of each device in scenario.ts. Every description, marking and maker part
// number here is invented for the demo (part numbers follow no real maker's scheme).
import type { MeasuredQuantity, MountType, PartCategory } from '@splitcase/contracts';
import { MeasurementSchema } from '../modules/measurements/measurement.entity';
import { readMeasuredValue } from '../modules/measurements/measurements.service';
import { defaultMount, newPart } from '../modules/parts/parts.service';
import { ConverterSchema, type Converter } from '../modules/power/converter.entity';
import { LoadSchema, type Load } from '../modules/power/load.entity';
import { PackSchema } from '../modules/power/pack.entity';
import { TeardownSchema } from '../modules/teardowns/teardown.entity';
import { UserSchema } from '../modules/users/user.entity';
import type { SeedContext } from './context';
import { seedModes } from './modes';
import { DEMO_DEVICES, teardownRef, type DemoDevice } from './scenario';

interface Line {
  designators?: string;
  category: PartCategory;
  description: string;
  marking?: string;
  makerPartNumber?: string;
  package?: string;
  quantity?: number;
  mount?: MountType;
  notes?: string;
}

const CHEMISTRY_WORDS: Record<string, string> = { 'li-ion': 'Li-ion', 'li-po': 'Li-ion pouch', lifepo4: 'LiFePO4', lto: 'LTO', nimh: 'NiMH', alkaline: 'alkaline', other: '' };

/** Supply voltage per load where the figures need more than the defaults (the cell under load). */
const SUPPLY_VOLTS: Record<string, number> = { 'halvix-duo': 3.65, 'zestora-pocketsun': 3.7, 'halvix-pro': 3.6, 'brightlark-trailbeam': 3.6, 'corvane-pocket': 3.7, 'corvane-neck': 3.7 };

const mAh = (ah: number) => `${Math.round(ah * 1000)} mAh`;
const grams = (kg: number) => `${Math.round(kg * 10000) / 10} g`;
const pct = (f: number) => `${Math.round(f * 100)} %`;

/** Small deterministic variation, so the readings do not look machine-made. */
function jitter(key: string, spread: number): number {
  let h = 2166136261;
  for (const ch of key) h = Math.imul(h ^ ch.charCodeAt(0), 16777619);
  return (((h >>> 0) % 1000) / 1000 - 0.5) * 2 * spread;
}

/** The parts list of a device, from its design: 10–30 lines. */
export function demoParts(d: DemoDevice): Line[] {
  const { cells, loads, converters } = d.design;
  const lines: Line[] = [];
  const cellCount = cells.series * cells.parallel;
  const pouch = cells.chemistry === 'li-po';
  lines.push({
    designators: 'BT1',
    category: 'cell',
    description: `${cells.format} ${CHEMISTRY_WORDS[cells.chemistry]} cell, ${cells.nominalV} V ${mAh(cells.ratedAh)}`,
    marking: `${cells.nominalV}V ${Math.round(cells.ratedAh * 1000)}mAh`,
    makerPartNumber: `CV-${pouch ? 'P' : 'C'}${Math.round(cells.ratedAh * 1000)}${cells.protection && pouch ? 'P' : ''}`,
    package: cells.format,
    quantity: cellCount,
    notes:
      cells.joining === 'welded-tab'
        ? 'Nickel tabs spot-welded'
        : cells.joining === 'soldered'
          ? 'Leads soldered straight to the cell'
          : cells.joining === 'holder'
            ? 'Sits in a spring holder'
            : 'On a two-pin plug',
  });
  if (cells.joining === 'holder') lines.push({ designators: 'BH1', category: 'connector', description: 'Spring cell holder, single 18650', makerPartNumber: 'QN-HLD18S', mount: 'tht' });
  if (cells.joining === 'welded-tab') lines.push({ category: 'wire', description: 'Nickel strip 0.15 mm × 5 mm', quantity: cellCount > 1 ? 2 : 1 });
  if (cells.protection) {
    const onBoard = 'On the protection board at the cell';
    lines.push({
      designators: 'PU1',
      category: 'ic',
      description: 'Single-cell protection IC (over-charge, over-discharge, over-current)',
      marking: 'PT1A',
      makerPartNumber: 'KV-PT61A',
      package: 'SOT-23-6',
      notes: onBoard,
    });
    lines.push({
      designators: 'PQ1',
      category: 'semiconductor',
      description: 'Dual N-channel MOSFET, common drain, 20 V',
      marking: 'D20N',
      makerPartNumber: 'SNW-DN2006',
      package: 'TSSOP-8',
      notes: onBoard,
    });
    lines.push({ designators: 'PR1', category: 'passive', description: 'Chip resistor, protection IC supply filter', marking: '331', package: '0402', notes: onBoard });
  }

  // Controller and power path.
  const hasMcu = loads.some((l) => l.kind === 'heater' || l.duty < 1 || l.kind === 'led');
  if (hasMcu) lines.push({ designators: 'U1', category: 'ic', description: '8-bit microcontroller, button input, PWM output', marking: 'M8C31', makerPartNumber: 'KV-M8C31S', package: 'SOP-8' });
  let u = 2;
  for (const c of converters) {
    if (c.topology === 'buck-boost' && c.role === 'output' && converters.some((x) => x.topology === 'buck-boost' && x.role === 'charge')) continue;
    const ref = `U${u++}`;
    if (c.topology === 'buck-boost' && c.role === 'charge' && converters.some((x) => x.topology === 'buck-boost' && x.role === 'output')) {
      lines.push({
        designators: ref,
        category: 'ic',
        description: 'Bidirectional single-cell charger and 5 V boost, one inductor',
        marking: 'BB2103',
        makerPartNumber: 'HX-BB2103',
        package: 'QFN-24 4×4',
      });
    } else if (c.role === 'charge' && c.topology === 'buck-boost') {
      lines.push({ designators: ref, category: 'ic', description: 'Four-switch buck-boost charger controller', marking: 'FS4B', makerPartNumber: 'HX-FB4410', package: 'QFN-32 5×5' });
    } else if (c.role === 'charge' && c.efficiency <= 0.8) {
      lines.push({ designators: ref, category: 'ic', description: 'Linear Li-ion charger, programmable current', marking: 'LC5A', makerPartNumber: 'TRL-LC0505', package: 'SOT-23-5' });
    } else if (c.role === 'charge') {
      lines.push({ designators: ref, category: 'ic', description: `Switch-mode single-cell charger, ${c.chargeA ?? 1} A`, marking: 'SC2A', makerPartNumber: 'TRL-SC2008', package: 'ESOP-8' });
    } else if (c.role === 'output') {
      lines.push({ designators: ref, category: 'ic', description: `Synchronous boost converter, ${c.vout} V output`, marking: 'B5V', makerPartNumber: 'MZ-BST506', package: 'SOT-23-6' });
    } else {
      lines.push({ designators: ref, category: 'ic', description: 'Synchronous buck LED driver, constant current', marking: 'LD8', makerPartNumber: 'MZ-LDB801', package: 'SOT-23-6' });
    }
  }
  if (converters.some((c) => c.vin >= 9 || c.vout >= 9)) {
    lines.push({ designators: `U${u++}`, category: 'ic', description: 'USB-C power-delivery controller', marking: 'PD20', makerPartNumber: 'SNW-PD2020', package: 'QFN-20 3×3' });
  }
  if (converters.some((c) => c.role !== 'charge' || c.efficiency > 0.8)) {
    lines.push({ designators: 'L1', category: 'inductor', description: 'Shielded power inductor 2.2 µH, 4 A', marking: '2R2', makerPartNumber: 'TRL-PI5022', package: '5 × 5 mm' });
  }
  if (loads.some((l) => l.kind !== 'usb-output' && (l.duty < 1 || l.kind === 'heater'))) {
    lines.push({ designators: 'Q1', category: 'semiconductor', description: 'N-channel MOSFET, 30 V, logic level, load switch', marking: 'N30L', makerPartNumber: 'SNW-NM3006', package: 'DFN-8 3×3' });
  }
  lines.push({ designators: 'D1', category: 'semiconductor', description: 'Schottky diode 40 V 2 A, input reverse protection', marking: 'S24', makerPartNumber: 'KV-SD402A', package: 'SMA' });

  // Passives: markings chosen so the decoder shows each code style.
  lines.push(
    { designators: 'R1, R2', category: 'passive', description: 'Chip resistor, button pull-ups', marking: '472', package: '0402', quantity: 2 },
    { designators: 'R3, R4', category: 'passive', description: 'Chip resistor, 1 %, output voltage divider', marking: '1002', package: '0603', quantity: 2 },
    { designators: 'R5', category: 'passive', description: 'Chip resistor, LED series', marking: '4R7', package: '0603' },
    { designators: 'R6', category: 'passive', description: 'Current-sense resistor, 1 %', marking: 'R010', package: '1206' },
    { designators: 'R7', category: 'passive', description: 'Chip resistor, 1 %, MOSFET gate series', marking: '68X', package: '0603', notes: 'EIA-96 code' },
    { designators: 'C1, C2, C5', category: 'passive', description: 'Ceramic capacitor X7R, decoupling', marking: '104', package: '0402', quantity: 3 },
    { designators: 'C3, C4', category: 'passive', description: 'Ceramic capacitor X5R, input and output bulk', marking: '226', package: '0805', quantity: 2 },
    { designators: 'C6', category: 'passive', description: 'Ceramic capacitor C0G, oscillator', marking: '4n7', package: '0402' },
  );

  // Loads.
  for (const l of loads) {
    if (l.kind === 'heater') {
      lines.push({
        designators: 'HT1, HT2'.split(', ').slice(0, l.count).join(', '),
        category: 'heater',
        description: `${l.label}, polyimide flex, ${l.ohms} Ω each`,
        makerPartNumber: 'QN-FH3060',
        quantity: l.count,
      });
    } else if (l.kind === 'motor') {
      lines.push({
        designators: l.count > 1 ? 'M1, M2' : 'M1',
        category: 'motor',
        description: l.label,
        makerPartNumber: l.label.includes('Brushless') ? 'VRN-BL2006' : 'VRN-DC1408',
        quantity: l.count,
      });
      lines.push({ category: 'enclosure', description: 'Fan impeller, PP', quantity: l.count });
    } else if (l.kind === 'led') {
      lines.push({
        designators: l.count > 1 ? 'LED1, LED2' : 'LED1',
        category: 'led',
        description: 'High-power white LED on aluminium star',
        marking: 'W35',
        makerPartNumber: 'LUX-W3535C',
        package: '3535',
        quantity: l.count,
      });
      lines.push({ category: 'enclosure', description: 'TIR optic, PMMA', quantity: l.count });
    } else if (l.kind === 'usb-output') {
      lines.push({
        designators: 'J2',
        category: 'connector',
        description: l.label.includes('USB-C') ? 'USB-C receptacle, 16 pins, output' : 'USB-A receptacle, output',
        makerPartNumber: l.label.includes('USB-C') ? 'QN-UC16S' : 'QN-UA04S',
        mount: 'tht',
      });
    }
  }
  lines.push({ designators: 'J1', category: 'connector', description: 'USB-C receptacle, 6 pins, charge input', makerPartNumber: 'QN-UC06S', mount: 'smt' });
  lines.push({ designators: 'LED3–LED6', category: 'led', description: 'Indicator LED, charge level', marking: '', makerPartNumber: 'LUX-I0603W', package: '0603', quantity: 4 });
  lines.push({ designators: 'SW1', category: 'switch', description: 'Tactile switch, side actuated', makerPartNumber: 'QN-TS0402', package: '4 × 2 mm' });

  if (d.design.hasTemperatureSensor) {
    const perHeater = d.key === 'halvix-pro' ? 2 : 1;
    lines.push({
      designators: perHeater > 1 ? 'RT1, RT2' : 'RT1',
      category: 'sensor',
      description: '10 kΩ NTC thermistor, B 3950, taped to the heat spreader',
      makerPartNumber: 'KV-NT103F',
      package: '0402',
      quantity: perHeater,
    });
  }

  // Mechanical.
  lines.push(
    { category: 'pcb', description: 'Main board, FR-4 2-layer 1.0 mm, green solder mask', makerPartNumber: undefined, quantity: 1 },
    { category: 'enclosure', description: d.category === 'pocket-heater' ? 'Aluminium shell halves, anodised' : 'ABS/PC shell, front and back', quantity: 2 },
    { category: 'fastener', description: 'Self-tapping screw, pan head, 2 × 5 mm', quantity: 4 },
    { category: 'label', description: 'Rating label, printed PET', quantity: 1 },
    { category: 'packaging', description: 'Printed carton with moulded pulp tray', quantity: 1 },
  );
  return lines;
}

interface Reading {
  quantity: MeasuredQuantity;
  text: string;
  subject: string;
  conditions?: string;
  instrument: string;
  uncertainty?: string;
}

const DMM = 'Bench DMM, 4½ digits (demo)';
const SCALE = 'Lab scale, 0.1 g (demo)';

/** A handful of readings per device, consistent with its design. */
export function demoReadings(d: DemoDevice): Reading[] {
  const { cells, loads, converters } = d.design;
  const out: Reading[] = [
    {
      quantity: 'voltage',
      text: `${(cells.nominalV + 0.12 + jitter(`${d.key}v`, 0.05)).toFixed(3)} V`,
      subject: 'Cell open-circuit voltage as received',
      conditions: '23 °C, rested 1 h',
      instrument: DMM,
      uncertainty: '±(0.05 % + 2 digits)',
    },
    { quantity: 'mass', text: grams(cells.massKg + jitter(`${d.key}m`, 0.0004)), subject: `Pack mass (${cells.series}S${cells.parallel}P, with tabs)`, instrument: SCALE, uncertainty: '±0.1 g' },
    {
      quantity: 'current',
      text: `${Math.round(40 + jitter(`${d.key}q`, 25))} µA`,
      subject: 'Standby current from the cell, switched off',
      conditions: 'Cell at 3.8 V',
      instrument: DMM,
      uncertainty: '±(0.5 % + 3 digits)',
    },
  ];
  for (const l of loads) {
    if (l.ohms) {
      for (let i = 0; i < l.count; i++) {
        out.push({
          quantity: 'resistance',
          text: `${(l.ohms + jitter(`${d.key}r${i}`, 0.04)).toFixed(2)} Ω`,
          subject: `${l.kind === 'heater' ? 'Heater element' : 'Load'} ${i === 0 ? 'front' : 'back'}, at its pads`,
          conditions: '23 °C, four-wire',
          instrument: DMM,
          uncertainty: '±(0.2 % + 5 digits)',
        });
      }
    }
    if (l.amps) {
      out.push({
        quantity: 'current',
        text: `${Math.round(l.amps * 1000 * (1 + jitter(`${d.key}a`, 0.03)))} mA`,
        subject: `${l.label}, full setting`,
        conditions: 'Cell at 3.8 V',
        instrument: DMM,
        uncertainty: '±(0.5 % + 3 digits)',
      });
    }
  }
  const charge = converters.find((c) => c.role === 'charge');
  if (charge?.chargeA) {
    out.push({
      quantity: 'current',
      text: `${(charge.chargeA * 0.96).toFixed(2)} A`,
      subject: 'Charge current, constant-current phase',
      conditions: `${charge.vin} V USB supply, cell at 3.6 V`,
      instrument: 'USB power meter (demo)',
      uncertainty: '±1 %',
    });
  }
  if (loads.some((l) => l.kind === 'heater')) {
    const peak = d.key === 'halvix-duo' ? 55 : d.key === 'halvix-pro' ? 47.5 : 44;
    out.push({
      quantity: 'temperature',
      text: `${peak} °C`,
      subject: 'Heater surface, hottest point, highest level',
      conditions: '25 °C ambient, 10 min, lying on a wooden bench',
      instrument: 'Type K thermocouple and logger (demo)',
      uncertainty: '±1.5 °C',
    });
  }
  return out;
}

async function seedTeardownBom(ctx: SeedContext, d: DemoDevice, teardownId: number): Promise<void> {
  const { em } = ctx;
  const teardown = await em.findOneOrFail(TeardownSchema, { id: teardownId }, { populate: ['engineer'] });

  demoParts(d).forEach((line, i) => {
    newPart(em, teardown, i + 1, {
      designators: line.designators || null,
      category: line.category,
      description: line.description,
      marking: line.marking || null,
      makerPartNumber: line.makerPartNumber ?? null,
      package: line.package ?? null,
      quantity: line.quantity ?? 1,
      mount: line.mount ?? defaultMount(line.category),
      notes: line.notes ?? null,
    });
  });

  const { cells, loads, converters } = d.design;
  em.create(PackSchema, {
    teardown,
    chemistry: cells.chemistry,
    cellFormat: cells.format,
    cellNominalVolts: cells.nominalV,
    cellMaxVolts: cells.maxV,
    cellRatedAh: cells.ratedAh,
    cellMeasuredAh: cells.measuredAh,
    series: cells.series,
    parallel: cells.parallel,
    packMassKg: cells.massKg,
    protection: cells.protection,
    joining: cells.joining,
    entered: { nominalVolts: `${cells.nominalV} V`, maxVolts: `${cells.maxV} V`, capacityAh: mAh(cells.ratedAh), measuredCapacityAh: mAh(cells.measuredAh), massKg: grams(cells.massKg) },
  } as never);

  const made: { spec: DemoDevice['design']['converters'][number]; entity: Converter }[] = [];
  for (const c of converters) {
    const entered: Record<string, string> = { inputVolts: `${c.vin} V`, outputVolts: `${c.vout} V`, efficiency: pct(c.efficiency) };
    if (c.chargeA) entered.chargeCurrentAmps = `${c.chargeA} A`;
    const label = c.role === 'charge' ? `USB charger (${c.topology})` : c.role === 'output' ? `${c.vout} V output (${c.topology})` : `LED driver (${c.topology})`;
    const entity = em.create(ConverterSchema, {
      teardown,
      label,
      topology: c.topology,
      role: c.role,
      vin: c.vin,
      vout: c.vout,
      ratedCurrentA: null,
      chargeCurrentA: c.chargeA ?? null,
      efficiency: c.efficiency,
      efficiencySource: c.source,
      entered,
    } as never) as Converter;
    made.push({ spec: c, entity });
  }

  const createdLoads: Load[] = [];
  for (const l of loads) {
    const via = l.via ? made.find((m) => m.spec.role !== 'charge' && (m.spec.topology === l.via || m.spec.topology === 'buck-boost')) : undefined;
    const supplyVolts = via ? via.spec.vout : (SUPPLY_VOLTS[d.key] ?? cells.nominalV);
    const entered: Record<string, string> = { supplyVolts: `${supplyVolts} V` };
    if (l.ohms) entered.resistanceOhms = `${String(l.ohms.toFixed(1)).replace('.', 'R')}`;
    if (l.amps) entered.currentAmps = l.amps < 1 ? `${Math.round(l.amps * 1000)} mA` : `${l.amps} A`;
    if (l.duty < 1) entered.duty = pct(l.duty);
    if (l.areaCm2) entered.heatedAreaM2 = `${l.areaCm2} cm²`;
    const load = em.create(LoadSchema, {
      teardown,
      kind: l.kind,
      label: l.label,
      resistanceOhms: l.ohms ?? null,
      currentAmps: l.amps ?? null,
      powerWatts: l.watts ?? null,
      supplyVolts,
      count: l.count,
      connection: l.connection,
      duty: l.duty,
      converter: via?.entity ?? null,
      heatedAreaM2: l.areaCm2 ? l.areaCm2 * 1e-4 : null,
      surfaceMaterial: l.kind === 'heater' ? 'metal-coated' : null,
      elementMaterial: l.kind === 'heater' ? (/flexible pcb/i.test(l.label) ? 'copper' : 'other') : null,
      heatedMassKg: l.heatedMassG ? l.heatedMassG / 1000 : null,
      entered: { ...entered, ...(l.heatedMassG ? { heatedMassKg: `${l.heatedMassG} g` } : {}) },
    } as never) as Load;
    createdLoads.push(load);
  }
  seedModes(em, d.key, teardown, createdLoads);

  const takenBy = await em.findOneOrFail(UserSchema, { id: teardown.engineer.id });
  demoReadings(d).forEach((r, i) => {
    const parsed = readMeasuredValue(r.quantity, r.text);
    em.create(MeasurementSchema, {
      teardown,
      quantity: r.quantity,
      value: parsed.value,
      unit: parsed.unit,
      entered: r.text,
      subject: r.subject,
      conditions: r.conditions ?? null,
      instrument: r.instrument,
      uncertainty: r.uncertainty ?? null,
      takenBy,
      takenAt: new Date(`${d.teardown.date}T${String(9 + Math.floor(i / 2)).padStart(2, '0')}:${i % 2 ? '40' : '10'}:00Z`),
    } as never);
  });
  await em.flush();
}

/** Seed step 'bom': parts, pack, loads, converters and readings for every demo teardown. */
export async function seedBom(ctx: SeedContext): Promise<void> {
  for (const d of DEMO_DEVICES) {
    const id = ctx.refs.get(teardownRef(d.key));
    if (typeof id !== 'number') throw new Error(`Seed step 'bom' needs the teardown of "${d.key}" (run the workspace step first).`);
    await seedTeardownBom(ctx, d, id);
  }
}
