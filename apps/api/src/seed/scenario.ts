// The invented demo scenario. Brackwater Devices (invented) is designing its own pocket heaters,
// power banks, headlamps and USB fans, and its teardown group studies rival products from invented
// makers. Every name, figure and price here is invented for the demo.
import type { Chemistry, DeviceCategory, TeardownStatus } from '@splitcase/contracts';

export const DEMO_COMPANY = 'Brackwater Devices';

export interface DemoDevice {
  /** Stable key other seed steps use to find this device and its teardown. */
  key: string;
  maker: string;
  model: string;
  category: DeviceCategory;
  retail: { price: number; currency: 'USD' | 'EUR' | 'GBP' | 'CNY'; seenOn: string; where: string };
  claims: { capacityAh?: number; capacityWh?: number; outputText?: string; outputWatts?: number; runtimeH?: number; powerW?: number };
  /** The design as found at the bench, in words: what the parts, power and runs steps model. */
  design: {
    cells: {
      chemistry: Chemistry;
      format: string;
      nominalV: number;
      maxV: number;
      ratedAh: number;
      measuredAh: number;
      series: number;
      parallel: number;
      massKg: number;
      protection: boolean;
      joining: 'welded-tab' | 'soldered' | 'holder' | 'connector';
    };
    loads: {
      kind: 'heater' | 'motor' | 'led' | 'usb-output';
      label: string;
      ohms?: number;
      amps?: number;
      watts?: number;
      count: number;
      connection: 'series' | 'parallel';
      duty: number;
      areaCm2?: number;
      heatedMassG?: number;
      via?: 'boost' | 'buck';
    }[];
    converters: { topology: 'buck' | 'boost' | 'buck-boost'; role: 'charge' | 'output' | 'load'; vin: number; vout: number; efficiency: number; source: 'measured' | 'assumed'; chargeA?: number }[];
    hasTemperatureSensor: boolean;
    notes: string;
  };
  teardown: { status: TeardownStatus; engineer: 'engineer' | 'engineer2'; date: string; unitLabel: string; summary: string; safetyNotes: string };
}

export const DEMO_DEVICES: DemoDevice[] = [
  {
    key: 'halvix-duo',
    maker: 'Halvix',
    model: 'HandGlow Duo 10',
    category: 'pocket-heater',
    retail: { price: 24.99, currency: 'USD', seenOn: '2026-10-04', where: 'Online marketplace listing (demo)' },
    claims: { capacityAh: 5.2, outputText: 'USB-A 5 V 1 A', outputWatts: 5, runtimeH: 6, powerW: 9 },
    design: {
      cells: { chemistry: 'li-ion', format: '18650', nominalV: 3.7, maxV: 4.2, ratedAh: 2.7, measuredAh: 2.62, series: 1, parallel: 1, massKg: 0.046, protection: false, joining: 'welded-tab' },
      loads: [
        { kind: 'heater', label: 'Flexible PCB heater elements (front and back)', ohms: 3.0, count: 2, connection: 'parallel', duty: 1, areaCm2: 2 * 6 * 4.5, heatedMassG: 30 },
        { kind: 'usb-output', label: 'USB-A power-bank output', amps: 1, count: 1, connection: 'parallel', duty: 1, via: 'boost' },
      ],
      converters: [
        { topology: 'buck-boost', role: 'charge', vin: 5, vout: 4.2, efficiency: 0.9, source: 'assumed', chargeA: 1 },
        { topology: 'buck-boost', role: 'output', vin: 3.7, vout: 5, efficiency: 0.88, source: 'measured' },
      ],
      hasTemperatureSensor: false,
      notes:
        'Two flexible-PCB heater elements of about 3 Ω wired in parallel straight across one 18650 cell, switched by a MOSFET under PWM from a small 8-bit microcontroller. One bidirectional buck-boost charger/power-bank IC with a single inductor does both the USB charging (buck) and the 5 V output (boost). No temperature sensor anywhere: the three heat levels are fixed PWM duties. Label claims 5200 mAh from a single 46 g cell.',
    },
    teardown: {
      status: 'published',
      engineer: 'engineer',
      date: '2026-10-12',
      unitLabel: 'Unit A',
      summary:
        'Single-cell pocket heater with a power-bank output. Two ≈3 Ω flexible heaters in parallel across the cell give about 9 W at full duty; the cell lasts a little over an hour at that level. No temperature sensing: heat levels are open-loop PWM.',
      safetyNotes: 'Cell discharged to 3.0 V before opening. Heater surface reached 55 °C on the highest level within 10 minutes at 25 °C ambient.',
    },
  },
  {
    key: 'zestora-pocketsun',
    maker: 'Zestora',
    model: 'Pocketsun S',
    category: 'pocket-heater',
    retail: { price: 14.9, currency: 'EUR', seenOn: '2026-09-21', where: 'High-street gadget shop (demo)' },
    claims: { capacityAh: 2.0, runtimeH: 4, powerW: 4 },
    design: {
      cells: { chemistry: 'li-po', format: 'pouch 503450', nominalV: 3.7, maxV: 4.2, ratedAh: 2.0, measuredAh: 1.93, series: 1, parallel: 1, massKg: 0.036, protection: true, joining: 'soldered' },
      loads: [{ kind: 'heater', label: 'Resistive film heater', ohms: 4.0, count: 1, connection: 'series', duty: 0.7, areaCm2: 30, heatedMassG: 25 }],
      converters: [{ topology: 'buck', role: 'charge', vin: 5, vout: 4.2, efficiency: 0.85, source: 'assumed', chargeA: 0.5 }],
      hasTemperatureSensor: true,
      notes: 'One pouch cell with a protection board, a linear-ish buck charger, one film heater under PWM with an NTC thermistor taped to the aluminium plate for closed-loop control.',
    },
    teardown: {
      status: 'published',
      engineer: 'engineer2',
      date: '2026-09-28',
      unitLabel: 'Unit A',
      summary: 'Small single-element heater with an NTC on the plate: the only heater in the set with closed-loop temperature control.',
      safetyNotes: 'Pouch cell not punctured or bent; removed with plastic tools.',
    },
  },
  {
    key: 'halvix-pro',
    maker: 'Halvix',
    model: 'HandGlow Pro 2',
    category: 'pocket-heater',
    retail: { price: 34.0, currency: 'USD', seenOn: '2026-10-30', where: 'Online marketplace listing (demo)' },
    claims: { capacityAh: 6.0, outputText: 'USB-C 5 V 2 A', outputWatts: 10, runtimeH: 8, powerW: 10 },
    design: {
      cells: { chemistry: 'li-ion', format: '18650', nominalV: 3.6, maxV: 4.2, ratedAh: 3.0, measuredAh: 2.91, series: 1, parallel: 2, massKg: 0.094, protection: true, joining: 'welded-tab' },
      loads: [{ kind: 'heater', label: 'Flexible PCB heater elements', ohms: 2.7, count: 2, connection: 'parallel', duty: 0.8, areaCm2: 2 * 7 * 5, heatedMassG: 40 }],
      converters: [
        { topology: 'buck-boost', role: 'charge', vin: 5, vout: 4.2, efficiency: 0.91, source: 'measured', chargeA: 2 },
        { topology: 'buck-boost', role: 'output', vin: 3.6, vout: 5, efficiency: 0.9, source: 'assumed' },
      ],
      hasTemperatureSensor: true,
      notes: 'Two 18650 cells in parallel with a protection IC, the same bidirectional buck-boost approach as the Duo, plus an NTC on each heater flex.',
    },
    teardown: {
      status: 'in_review',
      engineer: 'engineer',
      date: '2026-11-14',
      unitLabel: 'Unit A',
      summary: 'Two-cell successor of the Duo with NTC sensing on both heater flexes and a protection IC on the pack.',
      safetyNotes: 'Both cells discharged to 3.0 V; welded tabs cut, not desoldered.',
    },
  },
  {
    key: 'pellam-10',
    maker: 'Pellam Works',
    model: 'Stackcell 10',
    category: 'power-bank',
    retail: { price: 19.99, currency: 'USD', seenOn: '2026-08-30', where: 'Electronics retailer (demo)' },
    claims: { capacityAh: 10.0, capacityWh: 37, outputText: 'USB-A 5 V 2.4 A, USB-C 5 V 3 A', outputWatts: 15 },
    design: {
      cells: { chemistry: 'li-ion', format: '18650', nominalV: 3.7, maxV: 4.2, ratedAh: 3.35, measuredAh: 3.22, series: 1, parallel: 3, massKg: 0.147, protection: true, joining: 'welded-tab' },
      loads: [{ kind: 'usb-output', label: 'USB-C output', amps: 3, count: 1, connection: 'parallel', duty: 1, via: 'boost' }],
      converters: [
        { topology: 'buck', role: 'charge', vin: 5, vout: 4.2, efficiency: 0.9, source: 'assumed', chargeA: 2 },
        { topology: 'boost', role: 'output', vin: 3.7, vout: 5, efficiency: 0.87, source: 'measured' },
      ],
      hasTemperatureSensor: true,
      notes: 'Three 18650 cells in parallel (1S3P), separate charger and boost ICs, an NTC on the pack.',
    },
    teardown: {
      status: 'published',
      engineer: 'engineer2',
      date: '2026-09-05',
      unitLabel: 'Unit A',
      summary: 'Honest 10 000 mAh bank: 1S3P of 3.35 Ah cells, 87 % boost efficiency measured at 2 A.',
      safetyNotes: 'Pack kept in a fire-safe tray while the welded strip was cut.',
    },
  },
  {
    key: 'pellam-20',
    maker: 'Pellam Works',
    model: 'Stackcell 20 PD',
    category: 'power-bank',
    retail: { price: 39.99, currency: 'USD', seenOn: '2026-08-30', where: 'Electronics retailer (demo)' },
    claims: { capacityAh: 20.0, capacityWh: 74, outputText: 'USB-C PD up to 20 W', outputWatts: 20 },
    design: {
      cells: { chemistry: 'li-ion', format: '18650', nominalV: 3.7, maxV: 4.2, ratedAh: 3.35, measuredAh: 3.18, series: 1, parallel: 6, massKg: 0.29, protection: true, joining: 'welded-tab' },
      loads: [{ kind: 'usb-output', label: 'USB-C PD output at 9 V', amps: 2.22, count: 1, connection: 'parallel', duty: 1, via: 'boost' }],
      converters: [
        { topology: 'buck-boost', role: 'charge', vin: 9, vout: 4.2, efficiency: 0.92, source: 'assumed', chargeA: 4 },
        { topology: 'boost', role: 'output', vin: 3.7, vout: 9, efficiency: 0.86, source: 'measured' },
      ],
      hasTemperatureSensor: true,
      notes: 'Six 18650 cells in parallel, a PD controller plus a four-switch buck-boost power stage.',
    },
    teardown: {
      status: 'draft',
      engineer: 'engineer',
      date: '2026-11-22',
      unitLabel: 'Unit B',
      summary: 'Six-cell PD bank; capacity run still to repeat at 9 V output.',
      safetyNotes: 'Large pack: work on the fire-safe surface with the sand bucket at hand.',
    },
  },
  {
    key: 'zestora-slimvolt',
    maker: 'Zestora',
    model: 'Slimvolt 5',
    category: 'power-bank',
    retail: { price: 11.5, currency: 'GBP', seenOn: '2026-10-18', where: 'Supermarket checkout display (demo)' },
    claims: { capacityAh: 5.0, capacityWh: 18.5, outputText: 'USB-A 5 V 1 A', outputWatts: 5 },
    design: {
      cells: { chemistry: 'li-po', format: 'pouch 606090', nominalV: 3.7, maxV: 4.2, ratedAh: 5.0, measuredAh: 4.05, series: 1, parallel: 1, massKg: 0.078, protection: true, joining: 'soldered' },
      loads: [{ kind: 'usb-output', label: 'USB-A output', amps: 1, count: 1, connection: 'parallel', duty: 1, via: 'boost' }],
      converters: [
        { topology: 'buck', role: 'charge', vin: 5, vout: 4.2, efficiency: 0.85, source: 'assumed', chargeA: 1 },
        { topology: 'boost', role: 'output', vin: 3.7, vout: 5, efficiency: 0.8, source: 'measured' },
      ],
      hasTemperatureSensor: false,
      notes: 'One pouch cell that delivers about 81 % of its label capacity; single-chip charger/boost with an 80 % measured output efficiency.',
    },
    teardown: {
      status: 'published',
      engineer: 'engineer',
      date: '2026-10-25',
      unitLabel: 'Unit A',
      summary: 'Slim bank whose cell delivers about 81 % of the label capacity at 0.2 C.',
      safetyNotes: 'Pouch slightly swollen on arrival: photographed, then kept in the fire-safe box; not opened further.',
    },
  },
  {
    key: 'nordwick-ridgeline',
    maker: 'Nordwick Outdoor',
    model: 'Ridgeline 400',
    category: 'headlamp',
    retail: { price: 29.0, currency: 'EUR', seenOn: '2026-07-12', where: 'Outdoor shop (demo)' },
    claims: { capacityAh: 1.2, runtimeH: 5, outputText: '400 lm', powerW: 3 },
    design: {
      cells: { chemistry: 'li-po', format: 'pouch 803040', nominalV: 3.7, maxV: 4.2, ratedAh: 1.2, measuredAh: 1.17, series: 1, parallel: 1, massKg: 0.023, protection: true, joining: 'connector' },
      loads: [{ kind: 'led', label: 'High-power LED, constant-current driver', amps: 0.8, count: 1, connection: 'series', duty: 1, via: 'buck' }],
      converters: [
        { topology: 'buck', role: 'charge', vin: 5, vout: 4.2, efficiency: 0.85, source: 'assumed', chargeA: 0.5 },
        { topology: 'buck', role: 'load', vin: 3.7, vout: 3.0, efficiency: 0.9, source: 'assumed' },
      ],
      hasTemperatureSensor: true,
      notes: 'Pouch cell on a plug connector, synchronous buck LED driver with thermal step-down from an NTC on the LED board.',
    },
    teardown: {
      status: 'published',
      engineer: 'engineer2',
      date: '2026-07-20',
      unitLabel: 'Unit A',
      summary: 'Tidy headlamp: plug-in pouch cell (serviceable), buck LED driver with thermal step-down.',
      safetyNotes: 'LED at full output is too bright to look at; measured with an ND filter.',
    },
  },
  {
    key: 'brightlark-trailbeam',
    maker: 'Brightlark',
    model: 'Trailbeam C3',
    category: 'headlamp',
    retail: { price: 22.0, currency: 'USD', seenOn: '2026-07-12', where: 'Online marketplace listing (demo)' },
    claims: { capacityAh: 2.6, runtimeH: 8, outputText: '600 lm' },
    design: {
      cells: { chemistry: 'li-ion', format: '18650', nominalV: 3.6, maxV: 4.2, ratedAh: 2.6, measuredAh: 2.48, series: 1, parallel: 1, massKg: 0.045, protection: false, joining: 'holder' },
      loads: [{ kind: 'led', label: 'Two LEDs in parallel with ballast resistors', amps: 0.6, count: 2, connection: 'parallel', duty: 0.5 }],
      converters: [{ topology: 'buck', role: 'charge', vin: 5, vout: 4.2, efficiency: 0.8, source: 'assumed', chargeA: 1 }],
      hasTemperatureSensor: false,
      notes: 'Unprotected 18650 in a spring holder; LEDs driven straight from the cell through ballast resistors and a MOSFET under PWM.',
    },
    teardown: {
      status: 'draft',
      engineer: 'engineer2',
      date: '2026-11-27',
      unitLabel: 'Unit A',
      summary: 'Direct-drive headlamp: brightness falls with the cell voltage; no cell protection on board.',
      safetyNotes: 'Unprotected cell: never leave it charging unattended during tests.',
    },
  },
  {
    key: 'corvane-pocket',
    maker: 'Corvane',
    model: 'Breeze Pocket',
    category: 'usb-fan',
    retail: { price: 9.99, currency: 'USD', seenOn: '2026-06-02', where: 'Convenience store (demo)' },
    claims: { capacityAh: 2.0, runtimeH: 6 },
    design: {
      cells: { chemistry: 'li-ion', format: '18650', nominalV: 3.7, maxV: 4.2, ratedAh: 1.2, measuredAh: 1.15, series: 1, parallel: 1, massKg: 0.04, protection: false, joining: 'soldered' },
      loads: [{ kind: 'motor', label: 'Brushed DC fan motor', amps: 0.35, count: 1, connection: 'series', duty: 0.6 }],
      converters: [{ topology: 'buck', role: 'charge', vin: 5, vout: 4.2, efficiency: 0.75, source: 'assumed', chargeA: 0.5 }],
      hasTemperatureSensor: false,
      notes: 'A 1.2 Ah cell sold as 2000 mAh, wires soldered straight to the cell, linear charger IC, motor speed by PWM.',
    },
    teardown: {
      status: 'published',
      engineer: 'engineer',
      date: '2026-06-10',
      unitLabel: 'Unit A',
      summary: 'Cheap handheld fan: cell far below its label, wires soldered directly to the cell can.',
      safetyNotes: 'Soldered cell: heat damage possible; handled as a suspect cell.',
    },
  },
  {
    key: 'corvane-neck',
    maker: 'Corvane',
    model: 'Breeze Neck 2',
    category: 'usb-fan',
    retail: { price: 18.5, currency: 'USD', seenOn: '2026-06-02', where: 'Convenience store (demo)' },
    claims: { capacityAh: 4.0, runtimeH: 10 },
    design: {
      cells: { chemistry: 'li-ion', format: '18650', nominalV: 3.7, maxV: 4.2, ratedAh: 2.0, measuredAh: 1.94, series: 1, parallel: 2, massKg: 0.088, protection: true, joining: 'welded-tab' },
      loads: [{ kind: 'motor', label: 'Brushless blower motors (left and right)', amps: 0.28, count: 2, connection: 'parallel', duty: 0.7 }],
      converters: [{ topology: 'buck', role: 'charge', vin: 5, vout: 4.2, efficiency: 0.85, source: 'assumed', chargeA: 1 }],
      hasTemperatureSensor: false,
      notes: 'Two cells in parallel with protection, two small brushless blowers with integrated drivers.',
    },
    teardown: {
      status: 'in_review',
      engineer: 'engineer2',
      date: '2026-11-18',
      unitLabel: 'Unit A',
      summary: 'Neck fan with two brushless blowers; cells match the label once the 2P pack is counted.',
      safetyNotes: 'Welded pack kept whole; measured through the protection board.',
    },
  },
];

export const demoDevice = (key: string): DemoDevice => {
  const d = DEMO_DEVICES.find((x) => x.key === key);
  if (!d) throw new Error(`No demo device "${key}"`);
  return d;
};

/** Seed steps store ids here: refs.set(`device:${key}`, id) and refs.set(`teardown:${key}`, id). */
export const deviceRef = (key: string) => `device:${key}`;
export const teardownRef = (key: string) => `teardown:${key}`;
