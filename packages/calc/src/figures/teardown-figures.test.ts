import { describe, it, expect } from 'vitest';
import { FORMULAS } from './formulas';
import { HOT_SURFACE_CAUTION, labelClaimCheck, teardownFigures, type Figure, type TeardownFigureInput, type TeardownLoad, type TeardownPack } from './teardown-figures';

const byKey = (figures: Figure[], key: string): Figure => {
  const f = figures.find((x) => x.key === key);
  if (!f) throw new Error(`no figure ${key}; have ${figures.map((x) => x.key).join(', ')}`);
  return f;
};
const num = (figures: Figure[], key: string) => byKey(figures, key).value as number;

const cell: TeardownPack = {
  chemistry: 'li-ion',
  cellNominalVolts: 3.7,
  cellMaxVolts: 4.2,
  cellRatedAh: 2.7,
  series: 1,
  parallel: 1,
  protection: true,
};
const heaterPair: TeardownLoad = {
  id: 'heater',
  kind: 'heater',
  label: 'Heater elements',
  resistanceOhms: 3.0,
  supplyVolts: 3.65,
  count: 2,
  connection: 'parallel',
  duty: 1,
};
const pocketHeater: TeardownFigureInput = {
  pack: cell,
  loads: [heaterPair],
  converters: [],
  partCategories: ['cell', 'ic', 'passive', 'heater', 'connector'],
};

describe('pocket heater (REFERENCES §3 and §11)', () => {
  const { figures, suggestions } = teardownFigures(pocketHeater);

  it('two 3.0 Ω elements in parallel at 3.65 V: 4.440833 W each, 8.881667 W total, 2.433333 A [C]', () => {
    expect(num(figures, 'load.heater.elementPower')).toBeCloseTo(4.440833, 6);
    expect(num(figures, 'load.heater.power')).toBeCloseTo(8.881667, 6);
    expect(num(figures, 'load.power')).toBeCloseTo(8.881667, 6);
    expect(num(figures, 'load.current')).toBeCloseTo(2.433333, 6);
    expect(num(figures, 'load.averagePower')).toBeCloseTo(8.881667, 6);
    expect(byKey(figures, 'load.heater.power').inputs).toContainEqual({ key: 'supplyVolts', label: 'Supply voltage', value: 3.65, unit: 'V' });
    expect(num(figures, 'load.heater.power')).toBeCloseTo(8.881667, 6);
  });
  it('one 2.7 Ah 3.7 V cell is 9.99 Wh, class up-to-100-wh [C]', () => {
    expect(num(figures, 'pack.energy')).toBeCloseTo(9.99, 9);
    expect(byKey(figures, 'pack.transportClass').value).toBe('up-to-100-wh');
  });
  it('runtime ≈ 1.01 h at 8.88 W on 90 % of the rated 9.99 Wh, "a little over one hour" [C; CP]', () => {
    // issue 10 §2.6: usable energy = rated × usable fraction 0.9 [CP] (was the full rated energy, 1.124789 h)
    const t = num(figures, 'runtime.hours');
    expect(t).toBeCloseTo((9.99 * 0.9) / 8.881667, 5);
    expect(t).toBeGreaterThan(1);
    expect(t).toBeLessThan(1.25);
  });
  it('C-rate at the load current is 0.901235 C [C]', () => {
    expect(num(figures, 'pack.cRate')).toBeCloseTo(0.901235, 5);
    expect(byKey(figures, 'pack.cRate').warnings).toEqual([]);
  });
  it('suggests thermal.no-sensor (safety, major) because no part is a sensor [CP]', () => {
    const s = suggestions.find((x) => x.key === 'thermal.no-sensor');
    expect(s).toMatchObject({ kind: 'safety', severity: 'major' });
    expect(s!.detail).toMatch(/PWM regulation without feedback/);
    expect(s!.detail).toMatch(/nothing limits the surface temperature/);
    expect(suggestions.map((x) => x.key)).toEqual(['thermal.no-sensor']);
  });
  it('two cells in parallel last about two hours [CP]', () => {
    const two = teardownFigures({ ...pocketHeater, pack: { ...cell, parallel: 2 } });
    expect(num(two.figures, 'runtime.hours')).toBeCloseTo((2 * 9.99 * 0.9) / 8.881667, 5);
    expect(num(two.figures, 'pack.cRate')).toBeCloseTo(0.450617, 5);
  });
  it('every figure carries a formula and source from the catalogue, inputs and unit', () => {
    const catalogue = Object.values(FORMULAS);
    for (const f of figures) {
      expect(catalogue).toContainEqual({ formula: f.formula, source: f.source });
      expect(f.inputs.length).toBeGreaterThan(0);
      expect(typeof f.unit).toBe('string');
      expect(f.label.length).toBeGreaterThan(0);
    }
  });
  it('keys are unique and the order is stable', () => {
    const keys = figures.map((f) => f.key);
    expect(new Set(keys).size).toBe(keys.length);
    expect(keys).toEqual([
      'pack.energy',
      'pack.transportClass',
      'pack.shipping',
      'load.heater.power',
      'load.heater.elementPower',
      'load.power',
      'load.averagePower',
      'load.current',
      'pack.cRate',
      'runtime.hours',
    ]);
    expect(teardownFigures(pocketHeater)).toEqual({ figures, suggestions });
  });
  it('a sensor among the parts clears thermal.no-sensor', () => {
    const r = teardownFigures({ ...pocketHeater, partCategories: ['cell', 'sensor'] });
    expect(r.suggestions).toEqual([]);
    const ntc = teardownFigures({ ...pocketHeater, partCategories: ['NTC thermistor'] });
    expect(ntc.suggestions).toEqual([]);
  });
});

describe('supply voltage and converter defaults', () => {
  it('a load without a supply voltage runs at the pack voltage (series × nominal) [C]', () => {
    const r = teardownFigures({ ...pocketHeater, loads: [{ ...heaterPair, supplyVolts: undefined }] });
    // 3.7² / 1.5 = 9.126667 W
    expect(num(r.figures, 'load.power')).toBeCloseTo(9.126667, 6);
    expect(byKey(r.figures, 'load.heater.power').assumptions.join(' ')).toMatch(/pack nominal voltage, 3.7 V/);
  });
  it('a USB output through a boost converter: 5 W at 5 V, 5.5556 W and 1.5015 A from a 3.7 V pack at assumed η 0.9 [C]', () => {
    const r = teardownFigures({
      pack: { ...cell, cellRatedAh: 10 },
      loads: [{ id: 'usb', kind: 'usb-output', label: 'USB port', currentAmps: 1, count: 1, connection: 'series', duty: 1, converterId: 'b1' }],
      converters: [{ id: 'b1', topology: 'boost', role: 'output', vin: 3.7, vout: 5, efficiencySource: 'assumed' }],
      partCategories: [],
    });
    expect(num(r.figures, 'load.power')).toBeCloseTo(5, 12);
    expect(num(r.figures, 'load.current')).toBeCloseTo(5 / 0.9 / 3.7, 9);
    expect(byKey(r.figures, 'load.current').assumptions.join(' ')).toMatch(/converter "b1" assumed 0.9/);
    expect(byKey(r.figures, 'load.usb.power').assumptions.join(' ')).toMatch(/5 V output of converter "b1"/);
    // 37 Wh × usable 0.9 × η 0.9 / 5 W = 5.994 h (usable fraction: issue 10 §2.6)
    expect(num(r.figures, 'runtime.hours')).toBeCloseTo(5.994, 9);
  });
  it('power bank: 10 000 mAh at 3.7 V through a measured η 0.85 boost is 6 290 mAh at 5 V [C; CP]', () => {
    const r = teardownFigures({
      pack: { ...cell, cellRatedAh: 10 },
      loads: [],
      converters: [{ id: 'b1', topology: 'boost', role: 'output', vin: 3.7, vout: 5, efficiency: 0.85, efficiencySource: 'measured' }],
      partCategories: [],
    });
    expect(num(r.figures, 'powerbank.outputAh')).toBeCloseTo(6.29, 9);
    expect(byKey(r.figures, 'powerbank.outputAh').assumptions.join(' ')).not.toMatch(/assumed 0.85/);
  });
  it('an assumed efficiency value is used and said to be assumed', () => {
    const r = teardownFigures({
      pack: { ...cell, cellRatedAh: 10 },
      loads: [],
      converters: [{ id: 'b1', topology: 'boost', role: 'output', vin: 3.7, vout: 5.1, efficiency: 0.85, efficiencySource: 'assumed' }],
      partCategories: [],
    });
    expect(num(r.figures, 'powerbank.outputAh')).toBeCloseTo((37 * 0.85) / 5.1, 9);
    expect(byKey(r.figures, 'powerbank.outputAh').assumptions.join(' ')).toMatch(/assumed 0.85 \(not measured\)/);
  });
  it('an output converter that is not at USB 5 V gives no power-bank figure', () => {
    const r = teardownFigures({
      pack: cell,
      loads: [],
      converters: [{ id: 'b1', topology: 'boost', role: 'output', vin: 3.7, vout: 12, efficiencySource: 'assumed' }],
      partCategories: [],
    });
    expect(r.figures.map((f) => f.key)).not.toContain('powerbank.outputAh');
  });
  it('loads that cannot be computed are left out and said so', () => {
    const r = teardownFigures({
      loads: [
        { id: 'a', kind: 'motor', label: 'Fan', count: 1, connection: 'series', duty: 1, supplyVolts: 5 },
        { id: 'b', kind: 'led', label: 'LED', powerWatts: 0.5, count: 3, connection: 'parallel', duty: 0.5 },
        { id: 'c', kind: 'led', label: 'Indicator', powerWatts: 0.1, count: 1, connection: 'series', duty: 1, supplyVolts: 3 },
      ],
      converters: [],
      partCategories: [],
    });
    expect(r.figures.map((f) => f.key)).toEqual(['load.c.power', 'load.c.elementPower', 'load.power', 'load.averagePower']);
    const notes = byKey(r.figures, 'load.power').assumptions.join(' ');
    expect(notes).toMatch(/"Fan" left out: no element resistance/);
    expect(notes).toMatch(/"LED" left out: no supply voltage/);
    expect(notes).toMatch(/treated as resistive at its stated power/);
  });
  it('a current-described load is noted as resistive at that current; C-rate above 1 C warns', () => {
    const r = teardownFigures({
      pack: { ...cell, cellRatedAh: 1 },
      loads: [{ id: 'm', kind: 'motor', label: 'Motor', currentAmps: 1.5, count: 1, connection: 'series', duty: 0.5 }],
      converters: [],
      partCategories: [],
    });
    expect(byKey(r.figures, 'load.m.power').assumptions.join(' ')).toMatch(/resistive at its measured current/);
    expect(byKey(r.figures, 'load.m.power').inputs).toContainEqual({ key: 'elementAmps', label: 'Element current', value: 1.5, unit: 'A' });
    expect(num(r.figures, 'pack.cRate')).toBeCloseTo(1.5, 12);
    expect(byKey(r.figures, 'pack.cRate').warnings[0]).toMatch(/above 1 C/);
    // 3.7 Wh × usable 0.9 / (0.5 × 3.7 × 1.5 W) = 1.2 h
    expect(num(r.figures, 'runtime.hours')).toBeCloseTo(1.2, 6);
  });
  it('with no pack there is no pack current, runtime or pack figure', () => {
    const r = teardownFigures({ ...pocketHeater, pack: undefined });
    expect(r.figures.map((f) => f.key)).toEqual(['load.heater.power', 'load.heater.elementPower', 'load.power', 'load.averagePower']);
  });
  it('all loads off (duty 0) gives no runtime', () => {
    const r = teardownFigures({ ...pocketHeater, loads: [{ ...heaterPair, duty: 0 }] });
    expect(r.figures.map((f) => f.key)).not.toContain('runtime.hours');
    expect(num(r.figures, 'load.averagePower')).toBe(0);
  });
  it('an empty teardown gives nothing', () => {
    expect(teardownFigures({ loads: [], converters: [], partCategories: [] })).toEqual({ figures: [], suggestions: [] });
  });
});

describe('runtime and capacity against the label', () => {
  it('runtime uses the bench-run capacity when there is one, and warns against a far longer claim', () => {
    const r = teardownFigures({ ...pocketHeater, measuredCapacityAh: 2.5, claims: { runtimeH: 3 } });
    // 2.5 Ah × 3.7 V / 8.881667 W = 1.041471 h [C]
    expect(num(r.figures, 'runtime.hours')).toBeCloseTo(1.041471, 5);
    const f = byKey(r.figures, 'runtime.hours');
    expect(f.assumptions[0]).toMatch(/All loads at once/);
    expect(f.assumptions.join(' ')).toMatch(/bench run/);
    expect(f.warnings[0]).toMatch(/claims 3 h/);
    expect(f.inputs).toContainEqual({ key: 'claimedH', label: 'Claimed runtime', value: 3, unit: 'h' });
  });
  it('runtime uses the measured cell capacity otherwise', () => {
    const r = teardownFigures({ ...pocketHeater, pack: { ...cell, cellMeasuredAh: 2.6 } });
    expect(num(r.figures, 'runtime.hours')).toBeCloseTo((2.6 * 3.7) / 8.881667, 5);
    expect(byKey(r.figures, 'runtime.hours').assumptions.join(' ')).toMatch(/measured cell capacity/);
  });
  it('measured 8 Ah against a 10 Ah claim is 80 %, below 90 %: warned and suggested [C]', () => {
    const r = teardownFigures({ ...pocketHeater, claims: { capacityAh: 10 }, measuredCapacityAh: 8 });
    expect(num(r.figures, 'capacity.measuredVsLabel')).toBeCloseTo(80, 9);
    expect(byKey(r.figures, 'capacity.measuredVsLabel').warnings[0]).toMatch(/80 % of the label, below the 90 %/);
    const s = r.suggestions.find((x) => x.key === 'capacity.implausible');
    expect(s).toMatchObject({ kind: 'compliance', severity: 'major' });
    expect(s!.detail).toMatch(/80 %/);
  });
  it('a claim in Wh is compared in Wh; a custom warning level applies', () => {
    const r = teardownFigures({ ...pocketHeater, claims: { capacityWh: 37 }, measuredCapacityAh: 8, capacityWarnFraction: 0.75 });
    expect(num(r.figures, 'capacity.measuredVsLabel')).toBeCloseTo(80, 9);
    expect(byKey(r.figures, 'capacity.measuredVsLabel').warnings).toEqual([]);
    expect(r.suggestions.map((s) => s.key)).not.toContain('capacity.implausible');
  });
  it('without claims the cell rating is the label: 2.6 of 2.7 Ah is 96.296 % [C]', () => {
    const r = teardownFigures({ ...pocketHeater, pack: { ...cell, cellMeasuredAh: 2.6 } });
    expect(num(r.figures, 'capacity.measuredVsLabel')).toBeCloseTo(96.296296, 5);
    expect(byKey(r.figures, 'capacity.measuredVsLabel').assumptions[0]).toMatch(/rated energy of the cells/);
  });
  it('a 45 g cell labelled 9.9 Ah at 3.7 V (814 Wh/kg) is flagged against the 300 Wh/kg limit [C; CP]', () => {
    const r = teardownFigures({
      ...pocketHeater,
      pack: { ...cell, cellRatedAh: 9.9, packMassKg: 0.045 },
      partCategories: ['sensor'],
    });
    expect(num(r.figures, 'pack.specificEnergy')).toBeCloseTo(814, 0);
    expect(byKey(r.figures, 'pack.specificEnergy').warnings[0]).toMatch(/beyond what li-ion cells reach \(300 Wh\/kg\)/);
    const s = r.suggestions.find((x) => x.key === 'capacity.implausible');
    expect(s!.detail).toMatch(/the cell rating \(36.6 Wh\) in a 45 g pack would be 814 Wh\/kg/);
  });
  it('a plausible cell with a far larger label claim is flagged on the claim', () => {
    const r = teardownFigures({
      ...pocketHeater,
      pack: { ...cell, cellRatedAh: 3.35, cellNominalVolts: 3.6, packMassKg: 0.0485 },
      claims: { capacityAh: 10 },
      partCategories: ['sensor'],
    });
    expect(num(r.figures, 'pack.specificEnergy')).toBeCloseTo(248.66, 2);
    expect(byKey(r.figures, 'pack.specificEnergy').warnings).toEqual([]);
    expect(r.suggestions.find((x) => x.key === 'capacity.implausible')!.detail).toMatch(/the device label \(36 Wh\)/);
    const wh = teardownFigures({ ...pocketHeater, pack: { ...cell, packMassKg: 0.045 }, claims: { capacityWh: 5 }, partCategories: ['sensor'] });
    expect(wh.suggestions).toEqual([]);
  });
});

describe('pack rules', () => {
  it('14.4 V × 7 Ah = 100.8 Wh: class 100-to-160-wh and a minor compliance suggestion [C; S]', () => {
    const r = teardownFigures({
      pack: { ...cell, cellNominalVolts: 3.6, cellRatedAh: 7, series: 4 },
      loads: [],
      converters: [],
      partCategories: [],
    });
    expect(num(r.figures, 'pack.energy')).toBeCloseTo(100.8, 9);
    expect(byKey(r.figures, 'pack.transportClass').value).toBe('100-to-160-wh');
    expect(byKey(r.figures, 'pack.transportClass').warnings.join(' ')).toMatch(/airline approval/);
    expect(r.suggestions).toEqual([expect.objectContaining({ key: 'pack.over-100wh', kind: 'compliance', severity: 'minor' })]);
  });
  it('11.55 V × 13.9 Ah = 160.545 Wh: over-160-wh, major [C; S]', () => {
    const r = teardownFigures({
      pack: { ...cell, cellNominalVolts: 3.85, cellRatedAh: 13.9, series: 3 },
      loads: [],
      converters: [],
      partCategories: [],
    });
    expect(byKey(r.figures, 'pack.transportClass').value).toBe('over-160-wh');
    expect(r.suggestions[0]).toMatchObject({ key: 'pack.over-100wh', severity: 'major' });
  });
  it('exactly 100.0 Wh is not flagged ("not exceeding") [S]', () => {
    const r = teardownFigures({ pack: { ...cell, cellNominalVolts: 4, cellRatedAh: 25 }, loads: [], converters: [], partCategories: [] });
    expect(byKey(r.figures, 'pack.transportClass').value).toBe('up-to-100-wh');
    expect(r.suggestions).toEqual([]);
  });
  it('a lithium pack without protection is a safety suggestion; NiMH is not, and has no transport class', () => {
    const li = teardownFigures({ pack: { ...cell, protection: false }, loads: [], converters: [], partCategories: [] });
    expect(li.suggestions).toEqual([expect.objectContaining({ key: 'pack.no-protection', kind: 'safety', severity: 'major' })]);
    const lfp = teardownFigures({ pack: { ...cell, chemistry: 'lifepo4', cellNominalVolts: 3.2, protection: false }, loads: [], converters: [], partCategories: [] });
    expect(lfp.suggestions.map((s) => s.key)).toEqual(['pack.no-protection']);
    const nimh = teardownFigures({
      pack: { ...cell, chemistry: 'nimh', cellNominalVolts: 1.2, protection: false, series: 100 },
      loads: [],
      converters: [],
      partCategories: [],
    });
    expect(nimh.suggestions).toEqual([]);
    expect(nimh.figures.map((f) => f.key)).toEqual(['pack.energy']);
  });
});

describe('charge time', () => {
  const base: TeardownFigureInput = {
    pack: { ...cell, cellRatedAh: 3 },
    loads: [],
    converters: [{ id: 'c1', topology: 'buck', role: 'charge', vin: 5, vout: 4.2, efficiencySource: 'assumed', chargeCurrentA: 1.5 }],
    partCategories: [],
  };
  it('3.0 Ah at 1.5 A: about 2.62 h by the CC-CV estimate [C; CP]', () => {
    const f = byKey(teardownFigures(base).figures, 'charge.timeHours');
    expect(f.value as number).toBeCloseTo(2.623371, 6);
    expect(f.assumptions.join(' ')).toMatch(/Rough CC-CV estimate/);
    expect(f.warnings).toEqual([]);
  });
  it('warns when the charge output is above the pack charge limit (4.2 V li-ion) [S; CP]', () => {
    const r = teardownFigures({ ...base, converters: [{ ...base.converters[0]!, vout: 4.35 }] });
    expect(byKey(r.figures, 'charge.timeHours').warnings[0]).toMatch(/4.35 V is above the 4.2 V charge limit/);
    const noMax = teardownFigures({ ...base, pack: { ...base.pack!, cellMaxVolts: undefined, chemistry: 'lifepo4', cellNominalVolts: 3.2 } });
    expect(byKey(noMax.figures, 'charge.timeHours').warnings[0]).toMatch(/3.65 V charge limit/);
    const other = teardownFigures({ ...base, pack: { ...base.pack!, cellMaxVolts: undefined, chemistry: 'other' } });
    expect(byKey(other.figures, 'charge.timeHours').warnings).toEqual([]);
  });
  it('no charge current, no figure', () => {
    const r = teardownFigures({ ...base, converters: [{ ...base.converters[0]!, chargeCurrentA: undefined }] });
    expect(r.figures.map((f) => f.key)).not.toContain('charge.timeHours');
  });
});

describe('heater surface', () => {
  // Heat leaves by free convection, h = 10 W/m²K [S: Çengel, 2–25 W/m²K], and by radiation exact in T⁴,
  // εσA(T_s⁴ − T_a⁴), with the emissivity of the surface material (REFERENCES §7, §12); each rise below
  // is the root of P = h·A·ΔT + εσA((T_a + ΔT)⁴ − T_a⁴) found by bisection [C] (issue 10 §2.7; the
  // linear h_rad at ambient used before gave 28.8174 °C for the first case).
  const warm: TeardownFigureInput = {
    ...pocketHeater,
    loads: [{ ...heaterPair, duty: 0.5, heatedAreaM2: 0.01, surfaceMaterial: 'plastic' }],
    contactSeconds: 600,
    contactBasis: 'workspace default for pocket heaters',
  };
  it('8.881667 W over 100 cm² is 0.0888 W/cm²; at D 0.5 on plastic (ε 0.9) the rise is 27.4074 °C, 52.2291 °C at full duty [C]', () => {
    const { figures } = teardownFigures(warm);
    expect(num(figures, 'heater.powerDensity')).toBeCloseTo(0.08881667, 8);
    expect(num(figures, 'heater.surfaceRise')).toBeCloseTo(27.4074, 3);
    const f = byKey(figures, 'heater.surfaceRise');
    expect(f.assumptions.join(' ')).toMatch(/h = 10 W\/m²K .* radiation, εσ\(T_s⁴ − T_a⁴\) exact in T⁴ with ε 0.9 for plastic/);
    expect(f.assumptions.join(' ')).toMatch(/at full duty the rise would be 52.2 °C/);
    expect(f.inputs.find((i) => i.key === 'emissivity')?.value).toBe(0.9);
  });
  it('25 + 27.4 °C against 48 °C for 10 min of contact: margin −4.407 °C, with the hot-surface caution and why that contact time [C; M: ISO 13732-1]', () => {
    const { figures, suggestions } = teardownFigures(warm);
    const m = byKey(figures, 'heater.touchMargin');
    expect(m.value as number).toBeCloseTo(48 - 25 - 27.4074, 3);
    expect(m.warnings).toContain(HOT_SURFACE_CAUTION);
    expect(m.warnings[0]).toMatch(/above the 48 °C burn threshold for 10 min contact with plastic/);
    expect(m.assumptions.join(' ')).toMatch(/Ambient 25 °C assumed/);
    expect(m.assumptions.join(' ')).toMatch(/Contact time 10 min \(workspace default for pocket heaters\)/);
    expect(suggestions.map((s) => s.key)).toEqual(['thermal.no-sensor', 'thermal.touch-margin']);
    expect(suggestions[1]).toMatchObject({ kind: 'safety', severity: 'critical' });
  });
  it('the same pad held 1 min stays under the 60 °C of plastics [M: ISO 13732-1]; without a contact time 60 s is assumed and said', () => {
    const { figures, suggestions } = teardownFigures({ ...warm, contactSeconds: undefined, contactBasis: undefined });
    expect(num(figures, 'heater.touchMargin')).toBeCloseTo(60 - 25 - 27.4074, 3);
    expect(byKey(figures, 'heater.touchMargin').assumptions.join(' ')).toMatch(/Contact time 60 s assumed/);
    expect(suggestions.map((s) => s.key)).toEqual(['thermal.no-sensor']);
  });
  it('with a sensor the touch-margin suggestion stays, at major', () => {
    const { suggestions } = teardownFigures({ ...warm, partCategories: ['sensor'] });
    expect(suggestions).toEqual([expect.objectContaining({ key: 'thermal.touch-margin', severity: 'major' })]);
  });
  it('a gentle heater keeps a positive margin and no warning; bare metal is assumed when the material is missing', () => {
    const { figures, suggestions } = teardownFigures({
      ...pocketHeater,
      loads: [{ ...heaterPair, duty: 0.1, heatedAreaM2: 0.02 }],
      contactSeconds: 5,
      ambientC: 20,
    });
    // bare metal ε 0.1 at 20 °C: rise 4.195883 °C [C]; metal under 10 s: 55 °C [S: ECMA-287]; margin 55 − 24.195883 = 30.804117 °C
    const m = byKey(figures, 'heater.touchMargin');
    expect(m.value as number).toBeCloseTo(30.804117, 5);
    expect(m.warnings).toEqual([]);
    expect(m.assumptions.join(' ')).toMatch(/bare metal assumed/);
    expect(m.assumptions.join(' ')).not.toMatch(/Ambient 25/);
    expect(suggestions.map((s) => s.key)).toEqual(['thermal.no-sensor']);
  });
  it('a measured surface temperature replaces the estimate in the touch margin and the suggestion', () => {
    const { figures, suggestions } = teardownFigures({ ...warm, measuredSurface: { temperatureC: 47.5, basis: 'thermal run "Surface at level 3"' } });
    const m = byKey(figures, 'heater.touchMargin');
    // 48 °C (10 min) − 47.5 °C measured = 0.5 °C [C; M: ISO 13732-1]
    expect(m.value as number).toBeCloseTo(0.5, 12);
    expect(m.inputs).toEqual(expect.arrayContaining([expect.objectContaining({ key: 'measuredSurfaceC', value: 47.5 })]));
    expect(m.warnings).toEqual([]);
    expect(suggestions.map((x) => x.key)).toEqual(['thermal.no-sensor']);
    const hot = teardownFigures({ ...warm, measuredSurface: { temperatureC: 55.4, basis: 'thermal run "Highest level"' } });
    expect(byKey(hot.figures, 'heater.touchMargin').value as number).toBeCloseTo(-7.4, 12);
    expect(hot.suggestions.find((x) => x.key === 'thermal.touch-margin')?.detail).toMatch(/measured 55.4 °C \(thermal run "Highest level"\)/);
    expect(() => teardownFigures({ ...warm, measuredSurface: { temperatureC: Number.NaN, basis: 'x' } })).toThrow(RangeError);
  });
  it('two heaters: the summary is the one with the least margin, and each heater has its own figures', () => {
    const { figures } = teardownFigures({
      ...pocketHeater,
      loads: [
        { ...heaterPair, id: 'hand', label: 'Hand pad', duty: 0.2, heatedAreaM2: 0.01 },
        { ...heaterPair, id: 'back', label: 'Back pad', count: 1, duty: 1, heatedAreaM2: 0.01 },
      ],
    });
    const keys = figures.map((f) => f.key).filter((k) => k.startsWith('heater.'));
    expect(keys).toEqual([
      'heater.powerDensity',
      'heater.surfaceRise',
      'heater.touchMargin',
      'heater.hand.powerDensity',
      'heater.hand.surfaceRise',
      'heater.hand.touchMargin',
      'heater.back.powerDensity',
      'heater.back.surfaceRise',
      'heater.back.touchMargin',
      'heater.hand.dutyForTarget',
      'heater.back.dutyForTarget',
    ]);
    expect(byKey(figures, 'heater.touchMargin').label).toMatch(/Hottest heater \(Back pad\)/);
    expect(num(figures, 'heater.surfaceRise')).toBeCloseTo(num(figures, 'heater.back.surfaceRise'), 12);
  });
  it('a heater without an area still triggers the sensor rule, but no surface figures', () => {
    const { figures, suggestions } = teardownFigures(pocketHeater);
    expect(figures.some((f) => f.key.startsWith('heater.'))).toBe(false);
    expect(suggestions.map((s) => s.key)).toEqual(['thermal.no-sensor']);
  });
});

describe('traces', () => {
  const oz1 = 35e-6;
  const mil = 25.4e-6;
  it('a 10 mil 1 oz external trace is rated 0.8855 A at ΔT 10 °C; 1.2 A is over the rating [C; S: IPC-2221]', () => {
    const { figures, suggestions } = teardownFigures({
      loads: [],
      converters: [],
      partCategories: [],
      traces: [
        { id: 't1', label: 'Heater feed', lengthM: 0.1, widthM: 10 * mil, thicknessM: oz1, currentA: 1.2, layer: 'external' },
        { id: 't2', label: 'Sense line', lengthM: 0.1, widthM: 0.254e-3, thicknessM: oz1, currentA: 0.01, layer: 'internal', allowedRiseC: 20 },
      ],
    });
    expect(num(figures, 'trace.t1.rating')).toBeCloseTo(0.8855, 4);
    expect(byKey(figures, 'trace.t1.rating').warnings[0]).toMatch(/carries 1.2 A, above its 0.886 A rating/);
    expect(byKey(figures, 'trace.t1.rating').assumptions.join(' ')).toMatch(/10 °C assumed/);
    expect(num(figures, 'trace.t2.resistance')).toBeCloseTo(0.19394, 5);
    expect(byKey(figures, 'trace.t2.resistance').assumptions.join(' ')).toMatch(/would give 0.18875 Ω/);
    expect(byKey(figures, 'trace.t2.rating').warnings).toEqual([]);
    expect(suggestions).toEqual([expect.objectContaining({ key: 'trace.over-rating', kind: 'reliability', severity: 'major' })]);
    expect(suggestions[0]!.detail).toMatch(/"Heater feed" carries 1.2 A against 0.886 A/);
    expect(figures.map((f) => f.key)).toEqual(['trace.t1.rating', 'trace.t1.resistance', 'trace.t2.rating', 'trace.t2.resistance']);
  });
  it('passes the IPC-2221 range warnings through', () => {
    const { figures } = teardownFigures({
      loads: [],
      converters: [],
      partCategories: [],
      traces: [{ id: 't', label: 'Bus', lengthM: 0.05, widthM: 1e-3, thicknessM: oz1, currentA: 1, layer: 'external', allowedRiseC: 5 }],
    });
    expect(byKey(figures, 'trace.t.rating').warnings).toEqual([expect.stringMatching(/outside the 10–100 °C/)]);
  });
});

describe('invalid records throw a RangeError naming the field', () => {
  const bad = (patch: Partial<TeardownFigureInput>) => () => teardownFigures({ ...pocketHeater, ...patch });
  it('loads', () => {
    expect(bad({ loads: [{ ...heaterPair, duty: 1.2 }] })).toThrow(/Load "Heater elements" duty must be between 0 and 1/);
    expect(bad({ loads: [{ ...heaterPair, resistanceOhms: -3 }] })).toThrow(/Element resistance/);
    expect(bad({ loads: [{ ...heaterPair, count: 0 }] })).toThrow(/element count/);
    expect(bad({ loads: [{ ...heaterPair, kind: 'toaster' as never }] })).toThrow(/kind must be one of/);
    expect(bad({ loads: [{ ...heaterPair, connection: 'star' as never }] })).toThrow(/connection/);
    expect(bad({ loads: [{ ...heaterPair, heatedAreaM2: 0 }] })).toThrow(/heated area/);
    expect(bad({ loads: [{ ...heaterPair, surfaceMaterial: 'stone' as never }] })).toThrow(/surface material/);
    expect(bad({ loads: [{ ...heaterPair, supplyVolts: -1 }] })).toThrow(/supply voltage/);
    expect(bad({ loads: [heaterPair, heaterPair] })).toThrow(/id "heater" is used twice/);
    expect(bad({ loads: [{ ...heaterPair, id: '' }] })).toThrow(/Load 1 needs an id/);
    expect(bad({ loads: [{ ...heaterPair, converterId: 'nope' }] })).toThrow(/converter "nope", which is not in this teardown/);
    expect(bad({ loads: 'x' as never })).toThrow(/Loads must be a list/);
  });
  it('converters', () => {
    const c = { id: 'c', topology: 'buck' as const, role: 'charge' as const, vin: 5, vout: 4.2, efficiencySource: 'measured' as const };
    expect(bad({ converters: [{ ...c, efficiency: 1.2 }] })).toThrow(/Converter "c" efficiency/);
    expect(bad({ converters: [{ ...c, efficiency: 0 }] })).toThrow(/Converter "c" efficiency/);
    expect(bad({ converters: [{ ...c, vin: 0 }] })).toThrow(/input voltage/);
    expect(bad({ converters: [{ ...c, vout: 0 }] })).toThrow(/output voltage/);
    expect(bad({ converters: [{ ...c, topology: 'flyback' as never }] })).toThrow(/topology/);
    expect(bad({ converters: [{ ...c, role: 'spare' as never }] })).toThrow(/role/);
    expect(bad({ converters: [{ ...c, efficiencySource: 'guessed' as never }] })).toThrow(/efficiency source/);
    expect(bad({ converters: [{ ...c, chargeCurrentA: -1 }] })).toThrow(/charge current/);
    expect(bad({ converters: [c, c] })).toThrow(/used twice/);
    expect(bad({ converters: {} as never })).toThrow(/Converters must be a list/);
  });
  it('pack', () => {
    expect(bad({ pack: { ...cell, chemistry: 'lead-acid' as never } })).toThrow(/Pack chemistry/);
    expect(bad({ pack: { ...cell, series: 0 } })).toThrow(/Pack cells in series/);
    expect(bad({ pack: { ...cell, parallel: 1.5 } })).toThrow(/Pack cells in parallel/);
    expect(bad({ pack: { ...cell, cellNominalVolts: 0 } })).toThrow(/Cell nominal voltage/);
    expect(bad({ pack: { ...cell, cellRatedAh: 0 } })).toThrow(/Cell rated capacity/);
    expect(bad({ pack: { ...cell, cellMaxVolts: -4.2 } })).toThrow(/Cell maximum voltage/);
    expect(bad({ pack: { ...cell, cellMeasuredAh: -1 } })).toThrow(/Cell measured capacity/);
    expect(bad({ pack: { ...cell, packMassKg: 0 } })).toThrow(/Pack mass/);
  });
  it('traces, claims and settings', () => {
    const t = { id: 't', label: 'T', lengthM: 0.1, widthM: 1e-3, thicknessM: 35e-6, currentA: 1, layer: 'external' as const };
    expect(bad({ traces: [{ ...t, currentA: -1 }] })).toThrow(/Trace "T" current/);
    expect(bad({ traces: [{ ...t, layer: 'top' as never }] })).toThrow(/Trace "T" layer/);
    expect(bad({ traces: [{ ...t, allowedRiseC: 0 }] })).toThrow(/allowed temperature rise/);
    expect(bad({ traces: [{ ...t, widthM: 0 }] })).toThrow(/Trace width/);
    expect(bad({ traces: [t, t] })).toThrow(/used twice/);
    expect(bad({ traces: 5 as never })).toThrow(/Traces must be a list/);
    expect(bad({ partCategories: 'sensor' as never })).toThrow(/Part categories must be a list/);
    expect(bad({ claims: { capacityAh: 0 } })).toThrow(/Claimed capacity/);
    expect(bad({ claims: { capacityWh: -1 } })).toThrow(/Claimed energy/);
    expect(bad({ claims: { runtimeH: 0 } })).toThrow(/Claimed runtime/);
    expect(bad({ claims: { outputWatts: -5 } })).toThrow(/Claimed output power/);
    expect(bad({ measuredCapacityAh: -1 })).toThrow(/Measured capacity/);
    expect(bad({ capacityWarnFraction: 1.5 })).toThrow(/Capacity warning fraction/);
    expect(bad({ contactSeconds: 0 })).toThrow(/Contact time/);
    expect(bad({ ambientC: Number.NaN })).toThrow(/Ambient temperature/);
  });
});

describe('label claim against the pack mass, on its own', () => {
  it('a 46 g Li-ion cell labelled 5.2 Ah at 3.7 V: 19.24 Wh, 418 Wh/kg, beyond 300 Wh/kg [C; CP]', () => {
    const c = labelClaimCheck({ pack: { ...cell, packMassKg: 0.046 }, claims: { capacityAh: 5.2 } })!;
    expect(c.basis).toBe('label');
    expect(c.plausibility.claimedWh).toBeCloseTo(19.24, 9);
    expect(c.plausibility.specificEnergyWhPerKg).toBeCloseTo(418.26, 2);
    expect(c.plausibility.plausible).toBe(false);
  });
  it('a Wh claim is taken as it is; without a claim the cell rating is checked; without a mass there is nothing to check [C]', () => {
    const wh = labelClaimCheck({ pack: { ...cell, packMassKg: 0.147 }, claims: { capacityWh: 37 } })!;
    expect(wh.plausibility.specificEnergyWhPerKg).toBeCloseTo(251.7, 1);
    expect(wh.plausibility.plausible).toBe(true);
    expect(labelClaimCheck({ pack: { ...cell, packMassKg: 0.045 } })!.basis).toBe('cell-rating');
    expect(labelClaimCheck({ pack: cell, claims: { capacityAh: 5 } })).toBeUndefined();
    expect(labelClaimCheck({ claims: { capacityAh: 5 } })).toBeUndefined();
  });
});
