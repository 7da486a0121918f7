// Every field that takes a quantity or a price, declared once: its label as the screen shows it, its
// quantity kind, the example its placeholder shows, and how a bare number typed as text is read.
// The server's one reader (apps/api/src/lib/units.ts) and the web forms both read these declarations.
//
// The bare-number rule: a plain number typed as text ("46") is read in the unit of the field's
// example ("46 g") when that unit is the field's natural one, or refused with a message naming the
// field and the unit asked for ("Pack mass: add a unit, e.g. 46 g"). Where a plain number would most
// likely have been meant in another unit (a pack mass of "0.046", a capacity of "2.7", a duty of
// "0.6"), the field's `bareAbove`/`bareMax` bounds refuse it the same way instead of misreading it.
// A JSON *number* is always in the stored unit (SI; Wh, Ah and °C), as the API contract says.
import { SI_UNIT, type MeasuredQuantity } from './domain';

export const QUANTITY_KINDS = [
  'voltage',
  'current',
  'resistance',
  'capacitance',
  'inductance',
  'power',
  'energy',
  'capacity',
  'temperature',
  'mass',
  'length',
  'area',
  'time',
  'frequency',
  'fraction',
  'count',
  'pieces',
] as const;
export type QuantityKind = (typeof QUANTITY_KINDS)[number];

/** Unit each kind is stored in: SI, except Wh and Ah (the trade's units for energy and charge) and °C. */
export const STORED_UNIT: Record<QuantityKind, string> = {
  ...(({ other: _other, 'surface-temperature': _surface, ...measured }) => measured)(SI_UNIT),
  area: 'm²',
  fraction: '',
  count: '',
  pieces: '',
};

export interface QuantityField {
  /** The field's label on screen; messages about the field start with it. */
  label: string;
  kind: QuantityKind;
  /** One value with its unit, shown as the placeholder ("46 g"); its unit is the unit a bare number is read in. */
  example: string;
  /** The placeholder, when it says more than the example ("3R0 or 3.0 Ω"). */
  placeholder: string;
  /** A bare number typed as text: read in the example's unit, or refused ("add a unit"). */
  bare: 'example' | 'refuse';
  /** A bare number at or below this (in the example's unit) is refused as probably meant in another unit. */
  bareAbove?: number;
  /** A bare number above this (in the example's unit) is refused the same way. */
  bareMax?: number;
}

type FieldOptions = Partial<Pick<QuantityField, 'placeholder' | 'bareAbove' | 'bareMax'>>;

/** A field whose bare numbers are read in the example's unit. */
const inExample = (label: string, kind: QuantityKind, example: string, opts: FieldOptions = {}): QuantityField => ({
  label,
  kind,
  example,
  placeholder: opts.placeholder ?? example,
  bare: 'example',
  ...(opts.bareAbove !== undefined ? { bareAbove: opts.bareAbove } : {}),
  ...(opts.bareMax !== undefined ? { bareMax: opts.bareMax } : {}),
});
/** A field where a bare number is ambiguous (A or mA, mm or mil): it needs its unit. */
const withUnit = (label: string, kind: QuantityKind, example: string, opts: FieldOptions = {}): QuantityField => ({
  label,
  kind,
  example,
  placeholder: opts.placeholder ?? example,
  bare: 'refuse',
});

/** The unit part of a field's example ("46 g" → "g", "60 %" → "%", "2" → ""). */
export const exampleUnit = (field: Pick<QuantityField, 'example'>): string => field.example.replace(/^[-+]?[\d.,\s]*\d/, '').trim();

/** What the form says about plain numbers in the field ("plain numbers in g", "type the unit"). */
export function bareHint(field: QuantityField): string {
  if (field.kind === 'count' || field.kind === 'pieces') return 'a whole number';
  return field.bare === 'example' ? `plain numbers in ${exampleUnit(field)}` : 'type the unit';
}

/**
 * A stored value as text a form can send back unchanged: the exact number with the stored unit
 * ("0.046 kg", "2.7 Ah", "100 %"), so a saved value read again is never taken as a bare number.
 */
export function storedQuantityText(value: number | null | undefined, kind: QuantityKind): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '';
  if (kind === 'fraction') return `${Number((value * 100).toPrecision(12))} %`;
  const unit = STORED_UNIT[kind];
  return unit ? `${value} ${unit}` : String(value);
}

// Proportions: "60 %"; "1" or "0.6" could be 100 %, 1 % or 60 %, so a plain number must be above 1.
const percent = (label: string, example: string) => inExample(label, 'fraction', example, { bareAbove: 1 });

// ---- power system (pack, loads, converters) ----

export const PACK_FIELDS = {
  nominalVolts: inExample('Nominal voltage (per cell)', 'voltage', '3.7 V'),
  maxVolts: inExample('Charge voltage (per cell)', 'voltage', '4.2 V'),
  // A cell of 50 mAh or less is not one of ours; "2.7" was meant in Ah.
  capacityAh: inExample('Rated capacity (per cell)', 'capacity', '2700 mAh', { bareAbove: 50 }),
  measuredCapacityAh: inExample('Measured capacity (per cell)', 'capacity', '2620 mAh', { bareAbove: 50 }),
  series: inExample('Cells in series', 'count', '1'),
  parallel: inExample('Cells in parallel', 'count', '1'),
  // A pack of 5 g or less is not one of ours; "0.046" or "1.2" was meant in kg.
  massKg: inExample('Pack mass', 'mass', '46 g', { bareAbove: 5 }),
  // Ω or mΩ: a bare number is ambiguous.
  internalResistanceOhms: withUnit('Internal resistance (per cell, DC)', 'resistance', '50 mΩ'),
} as const satisfies Record<string, QuantityField>;

export const LOAD_FIELDS = {
  resistanceOhms: inExample('Resistance (per element)', 'resistance', '3.0 Ω', { placeholder: '3R0 or 3.0 Ω' }),
  currentAmps: withUnit('Current (per element)', 'current', '350 mA'),
  powerWatts: inExample('Power (per element)', 'power', '4.4 W'),
  supplyVolts: inExample('Supply voltage', 'voltage', '3.65 V'),
  count: inExample('Count', 'count', '2'),
  duty: percent('Duty', '60 %'),
  // Below 0.1 cm² the number was meant in m².
  heatedAreaM2: inExample('Heated area', 'area', '27 cm²', { bareAbove: 0.1 }),
  // A heated mass of 1 g or less is not one of ours; "0.04" was meant in kg.
  heatedMassKg: inExample('Heated mass', 'mass', '40 g', { bareAbove: 1 }),
} as const satisfies Record<string, QuantityField>;

/** The two readings of the DC internal-resistance method (IEC 61960-3), as the pack card labels them. */
export const INTERNAL_RESISTANCE_READING_FIELDS = {
  lowAmps: withUnit('Low current I₁', 'current', '0.6 A'),
  lowVolts: inExample('Voltage at I₁', 'voltage', '3.912 V'),
  highAmps: withUnit('High current I₂', 'current', '3 A'),
  highVolts: inExample('Voltage at I₂ (after 1 s)', 'voltage', '3.792 V'),
} as const satisfies Record<string, QuantityField>;

export const MODE_FIELDS = {
  quiescentAmps: withUnit('Standby current', 'current', '20 µA'),
  duty: percent('Duty', '60 %'),
  /** The surface temperature "Duty for" aims at. */
  targetSurfaceC: inExample('Target surface temperature', 'temperature', '45 °C'),
} as const satisfies Record<string, QuantityField>;

export const CONVERTER_FIELDS = {
  inputVolts: inExample('Input voltage', 'voltage', '5 V'),
  outputVolts: inExample('Output voltage', 'voltage', '4.2 V'),
  ratedCurrentAmps: withUnit('Rated output current', 'current', '2 A'),
  chargeCurrentAmps: withUnit('Charge current (charger)', 'current', '1 A'),
  efficiency: percent('Efficiency', '88 %'),
} as const satisfies Record<string, QuantityField>;

// ---- measurements: one field, its kind chosen by the quantity ----

const VALUE = 'Value with unit';
export const MEASUREMENT_FIELDS: Record<Exclude<MeasuredQuantity, 'other'>, QuantityField> = {
  voltage: inExample(VALUE, 'voltage', '3.92 V'),
  current: withUnit(VALUE, 'current', '350 mA'),
  resistance: inExample(VALUE, 'resistance', '3.02 Ω', { placeholder: '3.02 Ω or 3R0' }),
  capacitance: withUnit(VALUE, 'capacitance', '100 nF'),
  inductance: withUnit(VALUE, 'inductance', '2.2 µH'),
  power: inExample(VALUE, 'power', '4.4 W'),
  energy: inExample(VALUE, 'energy', '9.8 Wh'),
  capacity: inExample(VALUE, 'capacity', '2620 mAh', { bareAbove: 50 }),
  temperature: inExample(VALUE, 'temperature', '45 °C'),
  // A reading of the surface a hand touches.
  'surface-temperature': inExample(VALUE, 'temperature', '45 °C'),
  mass: inExample(VALUE, 'mass', '46 g'),
  length: withUnit(VALUE, 'length', '0.25 mm'),
  time: withUnit(VALUE, 'time', '10 min'),
  frequency: withUnit(VALUE, 'frequency', '20 kHz'),
};
/** "Other" keeps the number and the unit as typed. */
export const OTHER_MEASUREMENT_EXAMPLE = '1200 rpm';
export const measurementExample = (q: MeasuredQuantity) => (q === 'other' ? OTHER_MEASUREMENT_EXAMPLE : MEASUREMENT_FIELDS[q].placeholder);

// ---- bench tools ----

export const RUNTIME_TOOL_FIELDS = {
  cellNominalVoltage: inExample('Cell nominal voltage', 'voltage', '3.7 V'),
  cellCapacity: inExample('Cell capacity', 'capacity', '2700 mAh', { bareAbove: 50 }),
  series: inExample('Cells in series', 'count', '1'),
  parallel: inExample('Cells in parallel', 'count', '1'),
  loadPower: inExample('Load power', 'power', '9 W'),
  loadResistance: inExample('Load resistance', 'resistance', '3.0 Ω', { placeholder: '3R0' }),
  supplyVoltage: inExample('Voltage across the load', 'voltage', '3.65 V'),
  loadCurrent: withUnit('Current from the pack', 'current', '350 mA'),
  efficiency: percent('Converter efficiency', '90 %'),
  usableFraction: percent('Usable fraction', '95 %'),
  duty: percent('PWM duty', '60 %'),
  // One cell of 1 g or less: the number was meant in kg.
  cellMass: inExample('Mass of one cell', 'mass', '46 g', { bareAbove: 1 }),
} as const satisfies Record<string, QuantityField>;

export const HEATER_TOOL_FIELDS = {
  length: withUnit('Trace length', 'length', '100 mm'),
  width: withUnit('Trace width', 'length', '0.254 mm', { placeholder: '0.254 mm or 10 mil' }),
  /** Also a copper weight such as "1 oz" (read by the tools module). */
  thickness: withUnit('Copper thickness', 'length', '35 µm', { placeholder: '35 µm or 1 oz' }),
  temperature: inExample('Trace temperature', 'temperature', '20 °C'),
  supplyVoltage: inExample('Supply voltage', 'voltage', '3.65 V'),
  current: withUnit('Current', 'current', '1.2 A'),
  /** A difference: "10 °C" and "10 K" are the same rise. */
  temperatureRise: inExample('Allowed rise (IPC-2221)', 'temperature', '10 °C'),
  area: inExample('Heated area', 'area', '24 cm²', { bareAbove: 0.1 }),
} as const satisfies Record<string, QuantityField>;

// ---- device label claims ----

export const DEVICE_CLAIM_QUANTITY_FIELDS = {
  // Power banks and heaters are labelled in mAh; "5" or "20" was meant in Ah.
  claimCapacityAh: inExample('Capacity on the label', 'capacity', '5000 mAh', { bareAbove: 50 }),
  claimCapacityWh: inExample('Energy on the label', 'energy', '18.5 Wh'),
  claimOutputWatts: inExample('Output power', 'power', '10 W'),
  // As on a box: "6" is 6 h.
  claimRuntimeH: inExample('Runtime claimed', 'time', '6 h'),
  claimPowerW: inExample('Power claimed', 'power', '9 W'),
} as const satisfies Record<string, QuantityField>;

// ---- prices ----

/**
 * A money amount typed with or without its currency: "0.12", "$0.12", "0,12 €", "USD 0.12". A bare
 * amount is in the currency of the line (or the device's currency); a currency typed with it must
 * match that currency, or, where none is chosen yet, gives it.
 */
export interface PriceField {
  label: string;
  example: string;
}
export const PRICE_FIELDS = {
  unitPrice: { label: 'Unit price', example: '0.12' },
  retailPrice: { label: 'Retail price', example: '24.99' },
} as const satisfies Record<string, PriceField>;

/** Minimum quantity of a price break: pieces, "5000", "5k", "5 000" or "5,000". */
export const MIN_QTY_FIELD: QuantityField = inExample('Minimum quantity', 'pieces', '1000');
