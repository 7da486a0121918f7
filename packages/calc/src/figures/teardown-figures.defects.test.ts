// Figures that were wrong and are now checked, each against its source (REFERENCES labels).
import { describe, it, expect } from 'vitest';
import { teardownFigures, type Figure, type TeardownFigureInput, type TeardownLoad, type TeardownPack } from './index';

const byKey = (figures: Figure[], key: string, modeId?: string): Figure => {
  const f = figures.find((x) => x.key === key && (modeId === undefined || x.modeId === modeId));
  if (!f) throw new Error(`no figure ${key}${modeId ? `@${modeId}` : ''}; have ${figures.map((x) => x.key).join(', ')}`);
  return f;
};
const num = (figures: Figure[], key: string, modeId?: string) => byKey(figures, key, modeId).value as number;

const cell: TeardownPack = { chemistry: 'li-ion', cellNominalVolts: 3.7, cellMaxVolts: 4.2, cellRatedAh: 2.7, series: 1, parallel: 1, protection: true };
const heaterPair: TeardownLoad = { id: 'heater', kind: 'heater', label: 'Heater elements', resistanceOhms: 3.0, supplyVolts: 3.65, count: 2, connection: 'parallel', duty: 1 };
const pocketHeater: TeardownFigureInput = { pack: cell, loads: [heaterPair], converters: [], partCategories: ['cell', 'ic', 'heater'] };

describe('series packs: label and pack compared in Wh (issue 10 §2.1)', () => {
  // 2S of 5.0 Ah cells labelled 10 000 mAh: labels quote mAh at the cell's nominal voltage [CP, REFERENCES §5
  // "Rated mAh is quoted at cell voltage"]. Label 10 Ah × 3.7 V = 37 Wh; measured 4.9 Ah × 7.4 V = 36.26 Wh → 98 % [C].
  const twoS: TeardownFigureInput = {
    pack: { ...cell, cellRatedAh: 5.0, series: 2 },
    loads: [],
    converters: [],
    partCategories: ['cell'],
    claims: { capacityAh: 10 },
    measuredCapacityAh: 4.9,
  };
  it('is 98 % of its label, with no "label not supported" suggestion [C; CP]', () => {
    const { figures, suggestions } = teardownFigures(twoS);
    expect(num(figures, 'capacity.measuredVsLabel')).toBeCloseTo(98, 6);
    expect(suggestions.map((s) => s.key)).not.toContain('capacity.implausible');
    const f = byKey(figures, 'capacity.measuredVsLabel');
    expect(f.unit).toBe('%');
    expect(f.inputs.find((i) => i.key === 'labelWh')?.value).toBeCloseTo(37, 9);
    expect(f.inputs.find((i) => i.key === 'measuredWh')?.value).toBeCloseTo(36.26, 9);
    expect(f.assumptions.join(' ')).toMatch(/cell nominal voltage/);
  });
});

describe('runtime on usable energy (issue 10 §2.6; REFERENCES Decisions: runtime = energy × η × usable fraction ÷ P)', () => {
  it('without a bench run: rated 9.99 Wh × usable 0.9 ÷ 8.881667 W = 1.012312 h, the fraction stated [C]', () => {
    const f = byKey(teardownFigures(pocketHeater).figures, 'runtime.hours');
    expect(f.value as number).toBeCloseTo((9.99 * 0.9) / 8.881667, 5);
    expect(f.assumptions.join(' ')).toMatch(/usable fraction 0\.9/);
  });
  it('the workspace fraction applies when given [C]', () => {
    expect(num(teardownFigures({ ...pocketHeater, usableFraction: 0.95 }).figures, 'runtime.hours')).toBeCloseTo((9.99 * 0.95) / 8.881667, 5);
  });
  it('with a discharge run its measured Wh is the usable energy: 9.2 Wh ÷ 8.881667 W = 1.035842 h [C]', () => {
    const f = byKey(teardownFigures({ ...pocketHeater, measuredDischarge: { ampHours: 2.5, wattHours: 9.2, basis: 'discharge run "Full"' } }).figures, 'runtime.hours');
    expect(f.value as number).toBeCloseTo(9.2 / 8.881667, 5);
    expect(f.assumptions.join(' ')).toMatch(/discharge run "Full"/);
  });
});

describe('surface temperature: emissivity by material, radiation exact (issue 10 §2.7; REFERENCES §7, §12)', () => {
  const pad = (surfaceMaterial: TeardownLoad['surfaceMaterial']): TeardownFigureInput => ({
    ...pocketHeater,
    loads: [{ ...heaterPair, heatedAreaM2: 0.01, surfaceMaterial }],
  });
  // P = h·A·ΔT + εσA(T_s⁴ − T_a⁴), h = 10 W/m²K, A = 0.01 m², T_a = 298.15 K, P = 8.881667 W, solved by bisection [C]:
  // ε 0.9 (plastic [S: Incropera Table A.11; M for the value]) → ΔT = 52.229 K; ε 0.1 (bare aluminium) → 81.515 K.
  it('plastic (ε 0.9): 52.23 K rise; bare metal (ε 0.1): 81.52 K [C]', () => {
    expect(num(teardownFigures(pad('plastic')).figures, 'heater.surfaceRise')).toBeCloseTo(52.2291, 3);
    expect(num(teardownFigures(pad('metal')).figures, 'heater.surfaceRise')).toBeCloseTo(81.5155, 3);
  });
  it('names the emissivity it used', () => {
    const f = byKey(teardownFigures(pad('metal-coated')).figures, 'heater.surfaceRise');
    expect(f.inputs.find((i) => i.key === 'emissivity')?.value).toBeCloseTo(0.85, 9);
  });
  it('a measured temperature that the estimate misses by more than 30 % is said to disagree', () => {
    // estimate 25 + 52.23 = 77.2 °C; measured 45 °C: rise 20 K against 52.2 K estimated
    const f = byKey(teardownFigures({ ...pad('plastic'), measuredSurface: { temperatureC: 45, basis: 'reading "front face"' } }).figures, 'heater.touchMargin');
    expect(f.warnings.join(' ')).toMatch(/estimate .* disagrees/i);
  });
});

describe('implausible figures are flagged, never shown as good (issue 10 §2.8)', () => {
  it('a 46 kg pack for 9.99 Wh is 0.217 Wh/kg: flagged below the range of li-ion [S: 100–265 Wh/kg encyclopedic data]', () => {
    const f = byKey(teardownFigures({ ...pocketHeater, pack: { ...cell, packMassKg: 46 } }).figures, 'pack.specificEnergy');
    expect(f.value as number).toBeCloseTo(0.21717, 4);
    expect(f.implausible).toBe(true);
    expect(f.warnings.join(' ')).toMatch(/below/);
  });
  it('a 45 g cell at 9.99 Wh (222 Wh/kg) is not flagged [C]', () => {
    expect(byKey(teardownFigures({ ...pocketHeater, pack: { ...cell, packMassKg: 0.045 } }).figures, 'pack.specificEnergy').implausible).toBeFalsy();
  });
});

describe('smaller ones (issue 10 §2.14)', () => {
  it('a claimed output is set against the computed one [C]', () => {
    const f = byKey(teardownFigures({ ...pocketHeater, claims: { outputWatts: 10 } }).figures, 'claim.outputWatts');
    expect(f.value as number).toBeCloseTo(88.81667, 4);
    expect(f.warnings.join(' ')).toMatch(/below the claimed 10 W/);
  });
  it('100–160 Wh batteries installed in equipment: approval wording without the spares rule [S: IATA DGR]', () => {
    const f = byKey(teardownFigures({ ...pocketHeater, pack: { ...cell, cellNominalVolts: 3.6, cellRatedAh: 7, series: 4 } }).figures, 'pack.transportClass');
    expect(f.value).toBe('100-to-160-wh');
    expect(f.warnings.join(' ')).toMatch(/installed in equipment/i);
    expect(f.warnings.join(' ')).not.toMatch(/spares/);
  });
});

describe('claimed output and power (issue 10 §2.14)', () => {
  const withUsb: TeardownFigureInput = {
    ...pocketHeater,
    loads: [heaterPair, { id: 'u', kind: 'usb-output', label: 'USB', currentAmps: 1, supplyVolts: 5, count: 1, connection: 'series', duty: 1 }],
    claims: { outputWatts: 5, powerWatts: 10 },
  };
  it('the output claim is set against the USB output (5 W of 5 W), the power claim against the heat (8.88 of 10 W) [C]', () => {
    const { figures } = teardownFigures(withUsb);
    expect(num(figures, 'claim.outputWatts')).toBeCloseTo(100, 9);
    expect(byKey(figures, 'claim.outputWatts').warnings).toEqual([]);
    expect(num(figures, 'claim.powerWatts')).toBeCloseTo(88.81667, 4);
  });
  it('with modes, the highest mode counts', () => {
    const { figures } = teardownFigures({
      ...withUsb,
      modes: [
        { id: 'low', name: 'Low', loads: [{ loadId: 'heater', duty: 0.5 }] },
        { id: 'high', name: 'High', loads: [{ loadId: 'heater', duty: 1 }] },
      ],
    });
    expect(num(figures, 'claim.powerWatts')).toBeCloseTo(88.81667, 4);
    expect(byKey(figures, 'claim.powerWatts').inputs.find((i) => i.key === 'computedWatts')!.label).toMatch(/mode "High"/);
    expect(figures.find((f) => f.key === 'claim.outputWatts')).toBeUndefined(); // the USB output runs in no mode
  });
});
