// Words of the trade used across the product: each list is the set of values the API accepts,
// with the label the web app shows. Values are lower-case with '-' for spaces.
import { z } from 'zod';

const labelled = <const T extends readonly string[]>(values: T, labels: Record<T[number], string>) => ({ values, labels, schema: z.enum(values) });

export const DEVICE_CATEGORY = labelled(['pocket-heater', 'power-bank', 'headlamp', 'usb-fan', 'toothbrush', 'speaker', 'other'] as const, {
  'pocket-heater': 'Pocket heater',
  'power-bank': 'Power bank',
  headlamp: 'Headlamp',
  'usb-fan': 'USB fan',
  toothbrush: 'Electric toothbrush',
  speaker: 'Speaker',
  other: 'Other',
});
export type DeviceCategory = (typeof DEVICE_CATEGORY.values)[number];

export const TEARDOWN_STATUS = labelled(['draft', 'in_review', 'published'] as const, {
  draft: 'Draft',
  in_review: 'In review',
  published: 'Published',
});
export type TeardownStatus = (typeof TEARDOWN_STATUS.values)[number];

export const PART_CATEGORY = labelled(
  ['cell', 'ic', 'passive', 'inductor', 'semiconductor', 'connector', 'pcb', 'heater', 'sensor', 'switch', 'led', 'motor', 'wire', 'enclosure', 'fastener', 'label', 'packaging', 'other'] as const,
  {
    cell: 'Cell / pack',
    ic: 'IC',
    passive: 'Passive (R, C)',
    inductor: 'Inductor',
    semiconductor: 'Discrete semiconductor',
    connector: 'Connector',
    pcb: 'PCB',
    heater: 'Heater element',
    sensor: 'Sensor',
    switch: 'Switch / button',
    led: 'LED',
    motor: 'Motor',
    wire: 'Wire / cable',
    enclosure: 'Enclosure',
    fastener: 'Fastener',
    label: 'Label / print',
    packaging: 'Packaging',
    other: 'Other',
  },
);
export type PartCategory = (typeof PART_CATEGORY.values)[number];

export const MOUNT_TYPE = labelled(['smt', 'tht', 'manual'] as const, { smt: 'SMT', tht: 'Through-hole', manual: 'Manual' });
export type MountType = (typeof MOUNT_TYPE.values)[number];

export const FINDING_KIND = labelled(['cost-down', 'safety', 'reliability', 'manufacturability', 'user-experience', 'compliance', 'clever-idea'] as const, {
  'cost-down': 'Cost-down',
  safety: 'Safety',
  reliability: 'Reliability',
  manufacturability: 'Manufacturability',
  'user-experience': 'User experience',
  compliance: 'Compliance',
  'clever-idea': 'Clever idea',
});
export type FindingKind = (typeof FINDING_KIND.values)[number];

export const SEVERITY = labelled(['note', 'minor', 'major', 'critical'] as const, { note: 'Note', minor: 'Minor', major: 'Major', critical: 'Critical' });
export type Severity = (typeof SEVERITY.values)[number];

export const CHEMISTRY = labelled(['li-ion', 'li-po', 'lifepo4', 'lto', 'nimh', 'alkaline', 'other'] as const, {
  'li-ion': 'Li-ion (cylindrical)',
  'li-po': 'Li-ion pouch (Li-po)',
  lifepo4: 'LiFePO4',
  lto: 'LTO',
  nimh: 'NiMH',
  alkaline: 'Alkaline (primary)',
  other: 'Other',
});
export type Chemistry = (typeof CHEMISTRY.values)[number];

export const JOINING = labelled(['welded-tab', 'soldered', 'holder', 'connector', 'other'] as const, {
  'welded-tab': 'Spot-welded tabs',
  soldered: 'Soldered to the cell',
  holder: 'Cell holder',
  connector: 'Plug-in connector',
  other: 'Other',
});
export type Joining = (typeof JOINING.values)[number];

export const LOAD_KIND = labelled(['heater', 'motor', 'led', 'usb-output', 'other'] as const, {
  heater: 'Heater element',
  motor: 'Motor',
  led: 'LED',
  'usb-output': 'USB output',
  other: 'Other load',
});
export type LoadKind = (typeof LOAD_KIND.values)[number];

export const CONNECTION = labelled(['series', 'parallel'] as const, { series: 'Series', parallel: 'Parallel' });
export type Connection = (typeof CONNECTION.values)[number];

export const CONVERTER_TOPOLOGY = labelled(['buck', 'boost', 'buck-boost'] as const, { buck: 'Buck', boost: 'Boost', 'buck-boost': 'Buck-boost' });
export type ConverterTopology = (typeof CONVERTER_TOPOLOGY.values)[number];

export const CONVERTER_ROLE = labelled(['charge', 'output', 'load'] as const, {
  charge: 'Charging the pack',
  output: 'Power-bank output',
  load: 'Feeding a load',
});
export type ConverterRole = (typeof CONVERTER_ROLE.values)[number];

/** The surface a hand touches: bare metal radiates little (ε about 0.1), coated metal and the rest about 0.85–0.9. */
export const SURFACE_MATERIAL = labelled(['metal', 'metal-coated', 'glass', 'plastic', 'wood'] as const, {
  metal: 'Metal, bare',
  'metal-coated': 'Metal, painted or anodised',
  glass: 'Glass or ceramic',
  plastic: 'Plastic',
  wood: 'Wood',
});
export type SurfaceMaterial = (typeof SURFACE_MATERIAL.values)[number];

/** What a resistive element is made of, for its resistance when hot. */
export const ELEMENT_MATERIAL = labelled(['copper', 'other'] as const, { copper: 'Copper trace or foil', other: 'Other / not known' });
export type ElementMaterial = (typeof ELEMENT_MATERIAL.values)[number];

export const MEASURED_QUANTITY = labelled(
  ['voltage', 'current', 'resistance', 'capacitance', 'inductance', 'power', 'energy', 'capacity', 'temperature', 'surface-temperature', 'mass', 'length', 'time', 'frequency', 'other'] as const,
  {
    voltage: 'Voltage',
    current: 'Current',
    resistance: 'Resistance',
    capacitance: 'Capacitance',
    inductance: 'Inductance',
    power: 'Power',
    energy: 'Energy',
    capacity: 'Charge capacity',
    temperature: 'Temperature',
    'surface-temperature': 'Surface temperature (where a hand touches)',
    mass: 'Mass',
    length: 'Length',
    time: 'Time',
    frequency: 'Frequency',
    other: 'Other',
  },
);
export type MeasuredQuantity = (typeof MEASURED_QUANTITY.values)[number];

/** The SI unit each quantity is stored in. */
export const SI_UNIT: Record<MeasuredQuantity, string> = {
  voltage: 'V',
  current: 'A',
  resistance: 'Ω',
  capacitance: 'F',
  inductance: 'H',
  power: 'W',
  energy: 'Wh',
  capacity: 'Ah',
  temperature: '°C',
  'surface-temperature': '°C',
  mass: 'kg',
  length: 'm',
  time: 's',
  frequency: 'Hz',
  other: '',
};
