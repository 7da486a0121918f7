// Operating modes (issue 10 §1) and the calculations the bench expects (§3), against hand-worked values.
import { describe, it, expect } from 'vitest';
import { ALL_AT_ONCE_NOTE, teardownFigures, type Figure, type TeardownFigureInput, type TeardownLoad } from './index';

const find = (figures: Figure[], key: string, modeId?: string) => figures.find((f) => f.key === key && f.modeId === modeId);
const at = (figures: Figure[], key: string, modeId?: string): Figure => {
  const f = find(figures, key, modeId);
  if (!f) throw new Error(`no figure ${key}@${modeId}; have ${figures.map((x) => `${x.key}@${x.modeId ?? ''}`).join(', ')}`);
  return f;
};
const v = (figures: Figure[], key: string, modeId?: string) => at(figures, key, modeId).value as number;

// A single 2.7 Ah cell, two 3.0 Ω elements in parallel at 3.65 V, a 5 V 1 A USB output through a boost stage at assumed η 0.9.
const heater: TeardownLoad = { id: 'h', kind: 'heater', label: 'Heater elements', resistanceOhms: 3.0, supplyVolts: 3.65, count: 2, connection: 'parallel', duty: 1 };
const usb: TeardownLoad = { id: 'u', kind: 'usb-output', label: 'USB output', currentAmps: 1, count: 1, connection: 'series', duty: 1, converterId: 'boost' };
const base: TeardownFigureInput = {
  pack: { chemistry: 'li-ion', cellNominalVolts: 3.7, cellMaxVolts: 4.2, cellRatedAh: 2.7, series: 1, parallel: 1, protection: true },
  loads: [heater, usb],
  converters: [{ id: 'boost', topology: 'boost', role: 'output', vin: 3.7, vout: 5, efficiencySource: 'assumed' }],
  partCategories: ['cell', 'ic', 'heater'],
};
const modes: TeardownFigureInput['modes'] = [
  { id: 'high', name: 'High', loads: [{ loadId: 'h', duty: 1 }] },
  { id: 'low', name: 'Low', note: 'one press', loads: [{ loadId: 'h', duty: 0.5 }] },
  { id: 'bank', name: 'Power bank', loads: [{ loadId: 'u', duty: 1 }] },
  { id: 'standby', name: 'Standby', loads: [], quiescentAmps: 20e-6 },
];

describe('without modes every load runs at once, and the figures say so', () => {
  const { figures } = teardownFigures(base);
  it('8.881667 W + 5 W = 13.88 W total at full duty [C]', () => {
    expect(v(figures, 'load.power')).toBeCloseTo(13.881667, 5);
    expect(at(figures, 'load.power').assumptions[0]).toBe(ALL_AT_ONCE_NOTE);
    expect(at(figures, 'runtime.hours').assumptions).toContain(ALL_AT_ONCE_NOTE);
    expect(figures.some((f) => f.modeId !== undefined)).toBe(false);
  });
});

describe('per-mode figures (issue 10 §1)', () => {
  const { figures } = teardownFigures({ ...base, modes });
  it('high: 8.881667 W at the loads and from the pack, 2.433333 A, 0.901235 C [C: REFERENCES §3]', () => {
    expect(v(figures, 'mode.power', 'high')).toBeCloseTo(8.881667, 6);
    expect(v(figures, 'mode.packPower', 'high')).toBeCloseTo(8.881667, 6);
    expect(v(figures, 'mode.current', 'high')).toBeCloseTo(2.433333, 6);
    expect(v(figures, 'mode.cRate', 'high')).toBeCloseTo(0.901235, 6);
  });
  it('high: runtime 9.99 Wh × 0.9 ÷ 8.881667 W = 1.012310 h, "a little over one hour" [C; CP: REFERENCES §11]', () => {
    const t = v(figures, 'mode.runtime.hours', 'high');
    expect(t).toBeCloseTo(1.01231, 5);
    expect(t).toBeGreaterThan(1);
    expect(t).toBeLessThan(1.2);
  });
  it('low at duty 0.5: 4.440833 W, 1.216667 A average, 2.024620 h [C: REFERENCES §3 PWM]', () => {
    expect(v(figures, 'mode.power', 'low')).toBeCloseTo(4.440833, 6);
    expect(v(figures, 'mode.current', 'low')).toBeCloseTo(1.216667, 6);
    expect(v(figures, 'mode.runtime.hours', 'low')).toBeCloseTo(2.02462, 5);
  });
  it('power bank: 5 W at the port, 5.555556 W and 1.501502 A from the pack through η 0.9, 1.61838 h [C]', () => {
    expect(v(figures, 'mode.power', 'bank')).toBeCloseTo(5, 9);
    expect(v(figures, 'mode.packPower', 'bank')).toBeCloseTo(5 / 0.9, 6);
    expect(v(figures, 'mode.current', 'bank')).toBeCloseTo(5 / 0.9 / 3.7, 6);
    expect(v(figures, 'mode.runtime.hours', 'bank')).toBeCloseTo((9.99 * 0.9) / (5 / 0.9), 5);
    expect(at(figures, 'mode.packPower', 'bank').assumptions.join(' ')).toMatch(/assumed 0.9/);
  });
  it('standby at 20 µA: 2.7 Ah ÷ (2.5 % × 2.7 Ah + 20 µA × 730 h) = 32.886 months [C; CP: REFERENCES §12]', () => {
    expect(v(figures, 'mode.standby.months', 'standby')).toBeCloseTo(2.7 / (0.025 * 2.7 + 20e-6 * 730), 3);
    expect(find(figures, 'mode.runtime.hours', 'standby')).toBeUndefined();
    expect(v(figures, 'mode.current', 'standby')).toBeCloseTo(20e-6, 12);
  });
  it('no all-at-once totals when modes are recorded; whole-device figures stay', () => {
    expect(find(figures, 'load.power')).toBeUndefined();
    expect(find(figures, 'runtime.hours')).toBeUndefined();
    expect(v(figures, 'pack.energy')).toBeCloseTo(9.99, 9);
    expect(v(figures, 'load.h.power')).toBeCloseTo(8.881667, 6);
  });
  it('every figure has keyed inputs, unique within it, and a key unique with its mode', () => {
    const seen = new Set<string>();
    for (const f of figures) {
      const id = `${f.key}@${f.modeId ?? ''}`;
      expect(seen.has(id)).toBe(false);
      seen.add(id);
      const keys = f.inputs.map((i) => i.key);
      expect(new Set(keys).size).toBe(keys.length);
      for (const k of keys) expect(k).toMatch(/^[A-Za-z0-9.]+$/);
    }
  });
  it('a claimed runtime is set against the longest mode', () => {
    const r = teardownFigures({ ...base, modes, claims: { runtimeH: 4 } });
    expect(at(r.figures, 'mode.runtime.hours', 'low').warnings[0]).toMatch(/longest runtime of any recorded mode is 2.02 h/);
  });
  it('refuses a mode that names an unknown load, lists a load twice or has a duty above 1', () => {
    const bad = (m: NonNullable<TeardownFigureInput['modes']>) => () => teardownFigures({ ...base, modes: m });
    expect(bad([{ id: 'x', name: 'X', loads: [{ loadId: 'nope', duty: 1 }] }])).toThrow(/refers to load "nope"/);
    expect(
      bad([
        {
          id: 'x',
          name: 'X',
          loads: [
            { loadId: 'h', duty: 1 },
            { loadId: 'h', duty: 0.5 },
          ],
        },
      ]),
    ).toThrow(/twice/);
    expect(bad([{ id: 'x', name: 'X', loads: [{ loadId: 'h', duty: 1.5 }] }])).toThrow(/duty of load "h"/);
    expect(bad([{ id: 'x', name: '', loads: [] }])).toThrow(/needs a name/);
    expect(bad([{ id: 'x', name: 'X', loads: [], quiescentAmps: -1 }])).toThrow(/quiescent current/);
    expect(
      bad([
        { id: 'x', name: 'X', loads: [] },
        { id: 'x', name: 'Y', loads: [] },
      ]),
    ).toThrow(/used twice/);
  });
});

describe('heater in modes: surface, touch margin, resistance at temperature, transient, duty for a target (§3)', () => {
  const pad: TeardownLoad = { ...heater, heatedAreaM2: 0.01, surfaceMaterial: 'plastic' };
  const input: TeardownFigureInput = { ...base, loads: [pad, usb], modes, contactSeconds: 600 };
  const { figures, suggestions } = teardownFigures(input);
  it('high at full duty on plastic: 25 + 52.2291 °C, margin to 48 °C (10 min) −29.23 °C [C; M: ISO 13732-1]', () => {
    expect(v(figures, 'mode.surfaceTemperature', 'high')).toBeCloseTo(77.2291, 3);
    expect(v(figures, 'mode.touchMargin', 'high')).toBeCloseTo(48 - 77.2291, 3);
    expect(v(figures, 'mode.touchMargin', 'low')).toBeCloseTo(48 - 52.4074, 3);
    expect(find(figures, 'mode.touchMargin', 'bank')).toBeUndefined();
    expect(suggestions.find((s) => s.key === 'thermal.touch-margin')?.detail).toMatch(/in mode "High"/);
  });
  it('copper element: R(60 °C) = 3.00 × (1 + 0.00393 × 40) = 3.4716 Ω and 3.8376 W per element at 3.65 V [S: CRC α; C: REFERENCES §12]', () => {
    // Checked through the solver: with the element held at 60 °C by choosing the ambient so that the surface settles there
    const copper = teardownFigures({ ...input, loads: [{ ...pad, elementMaterial: 'copper' }, usb] });
    const hot = at(copper.figures, 'mode.heater.powerHot', 'high');
    const t = hot.inputs.find((i) => i.key === 'temperatureC')!.value as number;
    const ohms = hot.inputs.find((i) => i.key === 'ohmsHot')!.value as number;
    expect(ohms).toBeCloseTo(3 * (1 + 0.00393 * (t - 20)), 9);
    expect(hot.value as number).toBeCloseTo((2 * 3.65 ** 2) / ohms, 9);
    const at60 = 3 * (1 + 0.00393 * 40);
    expect(at60).toBeCloseTo(3.4716, 9);
    expect(3.65 ** 2 / at60).toBeCloseTo(3.8376, 4);
    // the hotter element draws less, so its surface is cooler than the cold-resistance estimate
    expect(v(copper.figures, 'mode.surfaceTemperature', 'high')).toBeLessThan(77.2291);
    expect(v(copper.figures, 'mode.power', 'high')).toBeCloseTo(8.881667, 6);
  });
  it('transient: 40 g plastic pad, τ = m·c/(h_eff·A) and the time to 48 °C from −τ ln(1 − 23/ΔT_ss) [S: Incropera ch. 5; C]', () => {
    const r = teardownFigures({ ...input, loads: [{ ...pad, heatedMassKg: 0.04 }, usb] });
    const tau = at(r.figures, 'mode.heater.timeConstant', 'high');
    const h = tau.inputs.find((i) => i.key === 'hEffective')!.value as number;
    expect(tau.value as number).toBeCloseTo((0.04 * 1400) / (h * 0.01), 9);
    const t = v(r.figures, 'mode.heater.timeToThreshold', 'high');
    expect(t).toBeCloseTo(-(tau.value as number) * Math.log(1 - 23 / 52.2291), 1);
  });
  it('duty for 45 °C: the loss at a 20 K rise over 100 cm² of plastic ÷ 8.881667 W [C]', () => {
    const f = at(figures, 'heater.dutyForTarget');
    const sigma = 5.670374419e-8;
    const needed = 10 * 0.01 * 20 + 0.9 * sigma * 0.01 * (318.15 ** 4 - 298.15 ** 4);
    expect(f.value as number).toBeCloseTo(needed / 8.881667, 6);
    expect(needed).toBeCloseTo(3.1959, 3);
  });
});

describe('the loaded cell: internal resistance (§3; REFERENCES §12)', () => {
  const r = teardownFigures({ ...base, modes, cellInternalResistance: { ohms: 0.05, basis: 'pulse in discharge run "Full"' } });
  it('high: 2.433333 A through 50 mΩ drops 0.121667 V and heats the cell by 0.296 W [C]', () => {
    expect(v(r.figures, 'mode.terminalVolts', 'high')).toBeCloseTo(3.7 - 2.433333 * 0.05, 6);
    expect(v(r.figures, 'mode.cellHeat', 'high')).toBeCloseTo(2.433333 ** 2 * 0.05, 6);
    expect(2.43 ** 2 * 0.05).toBeCloseTo(0.295, 3);
  });
  it('low at duty 0.5: the pulses draw the full current, the mean of i² is D·I² [C]', () => {
    expect(v(r.figures, 'mode.terminalVolts', 'low')).toBeCloseTo(3.7 - 2.433333 * 0.05, 6);
    expect(v(r.figures, 'mode.cellHeat', 'low')).toBeCloseTo(0.5 * 2.433333 ** 2 * 0.05, 6);
  });
  it('the elements fed straight from the cell: I = 3.7 / (1.5 + 0.05), P = U²/R = 8.5473 W [C]', () => {
    const i = 3.7 / 1.55;
    expect(v(r.figures, 'mode.loadedPower', 'high')).toBeCloseTo((i * 1.5) ** 2 / 1.5, 6);
    expect(v(r.figures, 'mode.loadedPower', 'high')).toBeCloseTo(8.5473, 3);
    expect(find(r.figures, 'mode.loadedPower', 'bank')).toBeUndefined();
  });
});

describe('shipping, charge side, power bank run, discharge power (§3)', () => {
  it('a 9.99 Wh cell in a heater: UN 3481, PI 967, Section II; a power bank ships as UN 3480, PI 965, at most 30 % charge [S: IATA DGR]', () => {
    const heaterShip = at(teardownFigures(base).figures, 'pack.shipping');
    expect(heaterShip.value).toBe('UN 3481, PI 967, Section II');
    expect(heaterShip.warnings.join(' ')).toMatch(/carrier's own rules govern/);
    const bank = at(teardownFigures({ ...base, deviceCategory: 'power-bank' }).figures, 'pack.shipping');
    expect(bank.value).toBe('UN 3480, PI 965, Section II');
    expect(bank.inputs.find((i) => i.key === 'stateOfChargeLimit')?.value).toBe('30 %');
    const big = at(teardownFigures({ ...base, pack: { ...base.pack!, cellRatedAh: 6, cellNominalVolts: 3.7 } }).figures, 'pack.shipping');
    expect(big.value).toBe('UN 3481, PI 967');
  });
  it('charging 1 A into a 3.7 V cell from 5 V at η 0.85 draws 0.8706 A: above 500 mA, so it needs a 900 mA port [C: REFERENCES §12; S: USB]', () => {
    const r = teardownFigures({
      ...base,
      converters: [...base.converters, { id: 'chg', topology: 'buck', role: 'charge', vin: 5, vout: 4.2, efficiency: 0.85, efficiencySource: 'measured', chargeCurrentA: 1 }],
    });
    const f = at(r.figures, 'charge.inputCurrent');
    expect(f.value as number).toBeCloseTo((3.7 * 1) / 0.85 / 5, 6);
    expect(f.inputs.find((i) => i.key === 'peakAmps')?.value as number).toBeCloseTo((4.2 * 1) / 0.85 / 5, 6);
    expect(f.warnings.join(' ')).toMatch(/Above 500 mA/);
    expect(v(r.figures, 'charge.cRate')).toBeCloseTo(1 / 2.7, 9);
  });
  it('a power-bank run measures η 0.82: the 5 V capacity uses it; 30 Wh delivered against a 37 Wh label is 81.08 % [C; CP]', () => {
    const r = teardownFigures({
      ...base,
      pack: { ...base.pack!, cellRatedAh: 10 },
      claims: { capacityAh: 10 },
      powerBankRun: { efficiency: 0.82, deliveredWh: 30, basis: 'power-bank run "5 V 1 A"' },
    });
    expect(v(r.figures, 'powerbank.outputAh')).toBeCloseTo((37 * 0.82) / 5, 9);
    expect(v(r.figures, 'powerbank.deliveredVsLabel')).toBeCloseTo((30 / 37) * 100, 6);
    const bad = teardownFigures({ ...base, powerBankRun: { efficiency: 1.2, deliveredWh: 12, basis: 'power-bank run "x"' } });
    expect(at(bad.figures, 'powerbank.outputAh').implausible).toBe(true);
    expect(v(bad.figures, 'powerbank.outputAh')).toBeCloseTo((9.99 * 0.9) / 5, 9);
  });
  it('average power over a discharge of a fixed 1.5 Ω from mean V² = 13.2 V²: 8.8 W, not (mean V)²/R [C: REFERENCES §12]', () => {
    const r = teardownFigures({ ...base, loads: [{ ...heater, supplyVolts: undefined }], measuredDischarge: { ampHours: 2.5, wattHours: 9.1, meanSquareVolts: 13.2, basis: 'discharge run "Full"' } });
    expect(v(r.figures, 'load.h.dischargePower')).toBeCloseTo(13.2 / 1.5, 9);
  });
});
