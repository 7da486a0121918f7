import { describe, expect, it } from 'vitest';
import {
  CONVERTER_FIELDS,
  DEVICE_CLAIM_QUANTITY_FIELDS,
  exampleUnit,
  HEATER_TOOL_FIELDS,
  LOAD_FIELDS,
  MEASUREMENT_FIELDS,
  MIN_QTY_FIELD,
  PACK_FIELDS,
  PRICE_FIELDS,
  RUNTIME_TOOL_FIELDS,
  storedQuantityText,
  type QuantityField,
} from '@splitcase/contracts';
import { QuantityError, readNumber, readPrice, readQuantitiesOrThrow, readQuantity, readQuantityFields } from './units';

// Sources: SI prefixes and unit symbols [S: BIPM SI Brochure, 9th ed., Table 7; IEC 80000]; the
// decimal marker (point or comma) and grouping digits in threes [S: SI Brochure §5.4.4]; resistor and
// capacitor letter-as-decimal-point codes [S: IEC 60062]; °F → °C and 1 mil = 25.4 µm are exact by
// definition [S]; the conversions are computed [C]; currency marks and which codes share "$" [CP].

const M = MEASUREMENT_FIELDS;
const P = PACK_FIELDS;
const L = LOAD_FIELDS;

describe('readQuantity: a value with its unit', () => {
  it.each<[string, QuantityField, number, string]>([
    // as the issue lists them
    ['2700mah', P.capacityAh, 2.7, 'Ah'],
    ['2700 MAH', P.capacityAh, 2.7, 'Ah'], // capacity has no mega: never mega-amp-hours
    ['2700 mAh', P.capacityAh, 2.7, 'Ah'],
    ['9.99wh', M.energy, 9.99, 'Wh'],
    ['9.99 WH', M.energy, 9.99, 'Wh'],
    ['10 min', M.time, 600, 's'],
    ['10min', M.time, 600, 's'],
    ['10 MIN', M.time, 600, 's'],
    ['25k', L.resistanceOhms, 25_000, 'Ω'],
    ['25K', L.resistanceOhms, 25_000, 'Ω'],
    ['3,65 V', P.nominalVolts, 3.65, 'V'],
    ['3,65V', P.nominalVolts, 3.65, 'V'],
    ['3 ohm', L.resistanceOhms, 3, 'Ω'],
    ['3 Ω', L.resistanceOhms, 3, 'Ω'],
    ['3 OHMS', L.resistanceOhms, 3, 'Ω'],
    ['3R0', L.resistanceOhms, 3, 'Ω'],
    ['4K7', L.resistanceOhms, 4700, 'Ω'],
    ['4k7', L.resistanceOhms, 4700, 'Ω'],
    ['1M', L.resistanceOhms, 1e6, 'Ω'], // mega is plausible for a resistance
    ['2M2', L.resistanceOhms, 2.2e6, 'Ω'],
    ['R010', L.resistanceOhms, 0.01, 'Ω'],
    ['4k7 Ω', L.resistanceOhms, 4700, 'Ω'], // the code with its unit after it
    ['4K7ohm', L.resistanceOhms, 4700, 'Ω'],
    ['47R', L.resistanceOhms, 47, 'Ω'],
    ['4n7F', M.capacitance, 4.7e-9, 'F'],
    ['50 mΩ', M.resistance, 0.05, 'Ω'],
    ['4.7 kΩ', M.resistance, 4700, 'Ω'],
    ['2 KOHM', M.resistance, 2000, 'Ω'],
    // other kinds, prefixes and spellings
    ['3.65V', M.voltage, 3.65, 'V'],
    ['3700 mV', M.voltage, 3.7, 'V'],
    ['350 mA', M.current, 0.35, 'A'],
    ['350 MA', M.current, 0.35, 'A'], // no mega-amps here: milliamps
    ['80 µA', M.current, 80e-6, 'A'],
    ['100 nF', M.capacitance, 1e-7, 'F'],
    ['100n', M.capacitance, 1e-7, 'F'],
    ['4n7', M.capacitance, 4.7e-9, 'F'],
    ['2.2 µH', M.inductance, 2.2e-6, 'H'],
    ['2.2 uH', M.inductance, 2.2e-6, 'H'],
    ['4.4 W', M.power, 4.4, 'W'],
    ['750 mw', M.power, 0.75, 'W'],
    ['3600 J', M.energy, 1, 'Wh'],
    ['46 g', M.mass, 0.046, 'kg'],
    ['46 G', M.mass, 0.046, 'kg'],
    ['45 °C', M.temperature, 45, '°C'],
    ['45c', M.temperature, 45, '°C'],
    ['45 deg C', M.temperature, 45, '°C'],
    ['113 °F', M.temperature, 45, '°C'],
    ['35 µm', HEATER_TOOL_FIELDS.thickness, 35e-6, 'm'],
    ['35 um', HEATER_TOOL_FIELDS.thickness, 35e-6, 'm'],
    ['0.25 MM', M.length, 0.00025, 'm'],
    ['10 mil', HEATER_TOOL_FIELDS.width, 254e-6, 'm'],
    ['27 cm²', L.heatedAreaM2, 0.0027, 'm²'],
    ['27 cm2', L.heatedAreaM2, 0.0027, 'm²'],
    ['27 cm^2', L.heatedAreaM2, 0.0027, 'm²'],
    ['1.5 h', M.time, 5400, 's'],
    ['20 kHz', M.frequency, 20_000, 'Hz'],
    ['1 khz', M.frequency, 1000, 'Hz'],
    ['2 mhz', M.frequency, 2e6, 'Hz'], // no millihertz here: megahertz (a switching frequency)
    ['60 %', L.duty, 0.6, ''],
    ['60%', L.duty, 0.6, ''],
    ['10 000 mAh', P.capacityAh, 10, 'Ah'],
    ['−0.35 V', M.voltage, -0.35, 'V'],
    ['5k', MIN_QTY_FIELD, 5000, ''],
    ['1.5k', MIN_QTY_FIELD, 1500, ''],
    ['5,000', MIN_QTY_FIELD, 5000, ''], // whole-number field: the comma groups thousands
    ['5 000', MIN_QTY_FIELD, 5000, ''],
  ])('%s in "%s" → %d %s', (text, field, value, unit) => {
    const q = readQuantity(text, field);
    expect(q.value).toBeCloseTo(value, 12);
    expect(q.unit).toBe(unit);
    expect(q.entered).toBe(text);
  });
});

describe('readQuantity: a bare number typed as text', () => {
  it.each<[string, QuantityField, number]>([
    ['46', P.massKg, 0.046], // 46 g, never 46 kg
    ['2700', P.capacityAh, 2.7],
    ['3.7', P.nominalVolts, 3.7],
    ['3,7', P.nominalVolts, 3.7],
    ['60', L.duty, 0.6],
    ['88', CONVERTER_FIELDS.efficiency, 0.88],
    ['27', L.heatedAreaM2, 0.0027],
    ['3', L.resistanceOhms, 3],
    ['2', L.count, 2],
    ['5000', DEVICE_CLAIM_QUANTITY_FIELDS.claimCapacityAh, 5],
    ['6', DEVICE_CLAIM_QUANTITY_FIELDS.claimRuntimeH, 21_600],
    ['45', M.temperature, 45],
    ['1000', MIN_QTY_FIELD, 1000],
  ])('"%s" in %s is read in the unit of its example', (text, field, value) => {
    expect(readQuantity(text, field).value).toBeCloseTo(value, 12);
  });

  it.each<[string, QuantityField, RegExp]>([
    ['350', L.currentAmps, /^Current \(per element\): add a unit, e.g\. 350 mA$/], // A or mA: ambiguous
    ['2', CONVERTER_FIELDS.ratedCurrentAmps, /^Rated output current: add a unit, e.g\. 2 A$/],
    ['10', M.time, /^Value with unit: add a unit, e.g\. 10 min$/], // s, min or h
    ['100', M.capacitance, /add a unit, e\.g\. 100 nF/],
    ['100', HEATER_TOOL_FIELDS.length, /^Trace length: add a unit, e\.g\. 100 mm$/], // mm, m or mil
    ['0.046', P.massKg, /^Pack mass: add a unit, e\.g\. 46 g \(a plain 0\.046 would be read as 0\.046 g\)$/],
    ['1.2', P.massKg, /^Pack mass: add a unit, e\.g\. 46 g/],
    ['2.7', P.capacityAh, /^Rated capacity \(per cell\): add a unit, e\.g\. 2700 mAh/],
    ['20', DEVICE_CLAIM_QUANTITY_FIELDS.claimCapacityAh, /^Capacity on the label: add a unit, e\.g\. 5000 mAh/],
    ['0.6', L.duty, /^Duty: add a unit, e\.g\. 60 %/], // 0.6 % or 60 %?
    ['1', L.duty, /^Duty: add a unit, e\.g\. 60 %/], // 1 % or 100 %?
    ['0.0027', L.heatedAreaM2, /^Heated area: add a unit, e\.g\. 27 cm²/],
  ])('"%s" in %s is refused, naming the field and the unit asked for', (text, field, message) => {
    expect(() => readQuantity(text, field)).toThrow(message);
  });

  it('a JSON number is in the stored unit (SI), as the API contract says', () => {
    expect(readQuantity(0.046, P.massKg).value).toBe(0.046);
    expect(readQuantity(2.7, P.capacityAh).value).toBe(2.7);
    expect(readQuantity(0.6, L.duty).value).toBe(0.6);
    expect(readQuantity(1, L.currentAmps).value).toBe(1);
    expect(readQuantity(3.7, M.voltage).entered).toBe('3.7');
  });
});

describe('readQuantity: refusals', () => {
  it.each<[string, QuantityField, RegExp]>([
    ['3 V', M.current, /^Value with unit: enter a current such as "350 mA" \("3 V" is not one\)$/],
    ['3.7 A', P.nominalVolts, /^Nominal voltage \(per cell\): enter a voltage/],
    ['banana', M.voltage, /voltage/],
    ['4000 bananas', DEVICE_CLAIM_QUANTITY_FIELDS.claimCapacityAh, /^Capacity on the label: enter a capacity/],
    ['1,000 g', M.mass, /"1,000" could be 1000 or 1\.000: write 1000, or 1\.000 with a point/],
    ['1 MOHM', L.resistanceOhms, /"MOHM" could be mΩ or MΩ: type the unit with its case/],
    ['1m', L.resistanceOhms, /"m" is read only as typed: type the unit in full \(mΩ or MΩ\)/],
    ['10MF', M.capacitance, /"MF" is read only as typed/], // "MF" meant microfarads on older parts
    ['1 MW', M.resistance, /resistance/],
    ['10 m', M.time, /time/], // m is not minutes
    ['47R', M.capacitance, /capacitance/], // R marks ohms, never farads
    ['2.5', P.series, /^Cells in series: enter a whole number$/],
    ['2 pcs', P.series, /whole number/],
    ['3 7 V', M.voltage, /"3 7" is not a number/],
    ['1.2.3 V', M.voltage, /"1\.2\.3" is not a number/],
  ])('"%s" in %s', (text, field, message) => {
    expect(() => readQuantity(text, field)).toThrow(message);
  });

  it('a blank is required; errors are QuantityErrors', () => {
    expect(() => readQuantity('  ', M.voltage)).toThrow(/^Required$/);
    expect(() => readQuantity(Number.NaN, M.voltage)).toThrow(QuantityError);
  });
});

describe('readNumber: decimal comma and digit grouping', () => {
  it.each<[string, boolean, number]>([
    ['3.65', false, 3.65],
    ['3,65', false, 3.65],
    ['0,12', false, 0.12],
    ['0,125', false, 0.125], // a leading 0 never groups thousands
    ['1234,567', false, 1234.567], // four digits before the comma: not grouping
    ['0,1234', false, 0.1234],
    ['1,000', true, 1000],
    ['12,500', true, 12_500],
    ['1,000,000', false, 1e6],
    ['1.000.000', false, 1e6],
    ['1,234.5', false, 1234.5],
    ['1.234,5', false, 1234.5],
    ['10 000', false, 10_000],
    ['10 000,5', false, 10_000.5],
    ['.5', false, 0.5],
    [',5', false, 0.5],
    ['1e3', false, 1000],
    ['-2', false, -2],
  ])('%s (whole-number field: %s) → %d', (text, whole, value) => {
    expect(readNumber(text, whole)).toBeCloseTo(value, 12);
  });

  it.each(['1,000', '12,500', '1.2,3,4', '1,23.4', '12 34', '1..2', 'x'])('refuses %s outside whole-number fields', (text) => {
    expect(() => readNumber(text)).toThrow(QuantityError);
  });
});

describe('every declared field reads its own example', () => {
  const all: [string, QuantityField][] = [
    ...Object.entries(PACK_FIELDS),
    ...Object.entries(LOAD_FIELDS),
    ...Object.entries(CONVERTER_FIELDS),
    ...Object.entries(MEASUREMENT_FIELDS),
    ...Object.entries(RUNTIME_TOOL_FIELDS),
    ...Object.entries(HEATER_TOOL_FIELDS),
    ...Object.entries(DEVICE_CLAIM_QUANTITY_FIELDS),
    ['minQty', MIN_QTY_FIELD],
  ];
  it.each(all)('%s: the example reads, and its number alone follows the bare-number rule', (_key, field) => {
    const withUnit = readQuantity(field.example, field);
    const number = field.example.replace(exampleUnit(field), '').trim();
    if (field.bare === 'example') expect(readQuantity(number, field).value).toBeCloseTo(withUnit.value, 12);
    else expect(() => readQuantity(number, field)).toThrow(`${field.label}: add a unit, e.g. ${field.example}`);
  });
});

describe('storedQuantityText: a stored value shown in a form reads back unchanged', () => {
  const all: QuantityField[] = [...Object.values(PACK_FIELDS), ...Object.values(LOAD_FIELDS), ...Object.values(CONVERTER_FIELDS), ...Object.values(MEASUREMENT_FIELDS), MIN_QTY_FIELD];
  it.each(all.map((f) => [f.label, f.kind, f] as const))('%s (%s)', (_label, kind, field) => {
    const samples = kind === 'count' || kind === 'pieces' ? [1, 2, 5000] : kind === 'fraction' ? [0.6, 1, 0.885] : [0.046, 2.7, 3.65, 1234.5];
    for (const v of samples) expect(readQuantity(storedQuantityText(v, kind), field).value).toBeCloseTo(v, 12);
    expect(storedQuantityText(0.046, 'mass')).toBe('0.046 kg');
    expect(storedQuantityText(1, 'fraction')).toBe('100 %');
    expect(storedQuantityText(null, 'mass')).toBe('');
  });
});

describe('readQuantityFields', () => {
  it('names every bad field and returns stored values with the typed text', () => {
    const ok = readQuantityFields({ a: '2700 mAh', b: 3.7, c: null }, { a: P.capacityAh, b: M.voltage, c: P.massKg });
    expect(ok.values).toEqual({ a: 2.7, b: 3.7, c: null });
    expect(ok.entered).toEqual({ a: '2700 mAh' });
    try {
      readQuantitiesOrThrow({ a: '3 V', b: 'x' }, { a: M.current, b: M.voltage });
      expect.unreachable();
    } catch (err) {
      expect((err as { fields: Record<string, string> }).fields).toEqual({ a: expect.stringContaining('current'), b: expect.stringContaining('voltage') });
    }
  });
});

describe('readPrice: amounts with or without their currency', () => {
  const F = PRICE_FIELDS.unitPrice;
  it.each<[string, string | null, number, string | null]>([
    ['0.12', 'USD', 0.12, 'USD'],
    ['$0.12', 'USD', 0.12, 'USD'],
    ['$ 0.12', 'CAD', 0.12, 'CAD'], // "$" is shared: checked, not chosen
    ['US$0.12', 'USD', 0.12, 'USD'],
    ['USD 0.12', 'USD', 0.12, 'USD'],
    ['0.12 usd', 'USD', 0.12, 'USD'],
    ['0,12 €', 'EUR', 0.12, 'EUR'],
    ['€0,12', 'EUR', 0.12, 'EUR'],
    ['1.234,50 €', 'EUR', 1234.5, 'EUR'],
    ['£0.17', 'GBP', 0.17, 'GBP'],
    ['¥0.85', 'CNY', 0.85, 'CNY'],
    ['97.5', 'GBP', 97.5, 'GBP'],
    // none chosen yet: an unshared mark or a code gives the currency
    ['€24.99', null, 24.99, 'EUR'],
    ['24,99 EUR', null, 24.99, 'EUR'],
    ['GBP 12', null, 12, 'GBP'],
    ['24.99', null, 24.99, null],
  ])('%s with the line in %s → %d %s', (text, currency, amount, code) => {
    expect(readPrice(text, F, currency)).toEqual({ amount, currency: code, entered: text });
  });

  it.each<[string, string | null, RegExp]>([
    ['0,12 €', 'USD', /^Unit price: "€" is EUR, but this price is in USD: choose EUR as the currency, or type the amount in USD$/],
    ['USD 0.12', 'EUR', /"USD" is USD, but this price is in EUR/],
    ['$0.12', 'EUR', /"\$" is one of USD, CAD, AUD, NZD, HKD, SGD, MXN, but this price is in EUR: type the amount in EUR/],
    ['$24.99', null, /"\$" is used by several currencies \(USD, CAD/],
    ['1,000', 'USD', /"1,000" could be 1000 or 1\.000/],
    ['twelve', 'USD', /^Unit price: enter an amount such as 0\.12/],
    ['$0.12 USD', 'USD', /enter an amount/],
  ])('%s with %s is refused', (text, currency, message) => {
    expect(() => readPrice(text, F, currency)).toThrow(message);
  });

  it('a JSON number is an amount in the line currency', () => {
    expect(readPrice(2.16, F, 'USD')).toEqual({ amount: 2.16, currency: 'USD', entered: '2.16' });
  });
});
