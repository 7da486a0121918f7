// Issue 3's public API: every contract function is exported from the package root with the
// contract's name and signature, and is documented in one line.
import { describe, it, expect, expectTypeOf } from 'vitest';
import * as calc from './index';
import ohmsLaw from './electrical/ohms-law.ts?raw';
import pack from './battery/pack.ts?raw';
import dutyCycle from './converters/duty-cycle.ts?raw';
import powerBank from './converters/power-bank.ts?raw';
import copper from './traces/copper.ts?raw';
import ipc2221 from './traces/ipc2221.ts?raw';
import resistorMarking from './markings/resistor-marking.ts?raw';
import capacitorMarking from './markings/capacitor-marking.ts?raw';
import colorBands from './markings/color-bands.ts?raw';
import eSeries from './markings/e-series.ts?raw';
import touch from './thermal/touch.ts?raw';
import convection from './thermal/convection.ts?raw';
import integrate from './runs/integrate.ts?raw';
import priceBreaks from './cost/price-breaks.ts?raw';
import currency from './cost/currency.ts?raw';
import pareto from './compare/pareto.ts?raw';

/** Contract name → number of parameters and the file that defines it. */
const CONTRACT: Record<string, [number, string]> = {
  powerFromVoltageAndResistance: [2, ohmsLaw],
  currentFromVoltageAndResistance: [2, ohmsLaw],
  combineResistances: [2, ohmsLaw],
  pwmAveragePower: [2, ohmsLaw],
  dutyForTargetPower: [2, ohmsLaw],
  packEnergyWh: [1, pack],
  runtimeHours: [1, pack],
  cRate: [2, pack],
  airTransportClass: [1, pack],
  specificEnergyWhPerKg: [2, pack],
  buckDutyCycle: [2, dutyCycle],
  boostDutyCycle: [2, dutyCycle],
  powerBankOutputAh: [1, powerBank],
  copperTraceResistance: [1, copper],
  ipc2221MaxCurrent: [1, ipc2221],
  decodeResistorMarking: [1, resistorMarking],
  decodeCapacitorMarking: [1, capacitorMarking],
  decodeColorBands: [1, colorBands],
  nearestPreferredValue: [2, eSeries],
  burnThresholdC: [1, touch],
  surfaceTemperatureRiseC: [1, convection],
  integrateRun: [1, integrate],
  unitPriceAtQuantity: [2, priceBreaks],
  convertCurrency: [4, currency],
  paretoFrontier: [1, pareto],
};

describe('issue 3 contract', () => {
  it('every contract function is exported from the package root with its number of parameters', () => {
    const exported = calc as unknown as Record<string, unknown>;
    for (const [name, [arity]] of Object.entries(CONTRACT)) {
      expect(typeof exported[name], name).toBe('function');
      expect((exported[name] as (...a: unknown[]) => unknown).length, name).toBe(arity);
    }
  });

  it('every contract function has a one-line doc comment right above it', () => {
    for (const [name, [, source]] of Object.entries(CONTRACT)) {
      const lines = source.split('\n');
      const at = lines.findIndex((l) => l.startsWith(`export function ${name}(`));
      expect(at, name).toBeGreaterThan(0);
      expect(lines[at - 1], name).toMatch(/^\/\*\* \S.* \*\/$/);
    }
  });

  it('signatures match the contract (checked by the type checker)', () => {
    type Layer = 'external' | 'internal';
    expectTypeOf(calc.powerFromVoltageAndResistance).toEqualTypeOf<(volts: number, ohms: number) => number>();
    expectTypeOf(calc.currentFromVoltageAndResistance).toEqualTypeOf<(volts: number, ohms: number) => number>();
    expectTypeOf(calc.combineResistances).toEqualTypeOf<(ohms: number[], connection: 'series' | 'parallel') => number>();
    expectTypeOf(calc.pwmAveragePower).toEqualTypeOf<(peakWatts: number, duty: number) => number>();
    expectTypeOf(calc.dutyForTargetPower).toEqualTypeOf<(peakWatts: number, targetWatts: number) => number>();
    expectTypeOf(calc.packEnergyWh).toEqualTypeOf<(p: { cellNominalVolts: number; cellCapacityAh: number; series?: number; parallel?: number }) => number>();
    expectTypeOf(calc.runtimeHours).toEqualTypeOf<(p: { energyWh: number; loadWatts: number; efficiency?: number; usableFraction?: number }) => number>();
    expectTypeOf(calc.cRate).toEqualTypeOf<(currentAmps: number, capacityAh: number) => number>();
    expectTypeOf(calc.airTransportClass).toEqualTypeOf<(wattHours: number) => 'up-to-100-wh' | '100-to-160-wh' | 'over-160-wh'>();
    expectTypeOf(calc.specificEnergyWhPerKg).toEqualTypeOf<(wattHours: number, massKg: number) => number>();
    expectTypeOf(calc.buckDutyCycle).toEqualTypeOf<(vin: number, vout: number) => number>();
    expectTypeOf(calc.boostDutyCycle).toEqualTypeOf<(vin: number, vout: number) => number>();
    expectTypeOf(calc.powerBankOutputAh).toEqualTypeOf<(p: { energyWh: number; outputVolts: number; efficiency: number }) => number>();
    // copperTraceResistance also takes an optional resistivity; it accepts every contract call.
    expectTypeOf(calc.copperTraceResistance).toExtend<(p: { lengthM: number; widthM: number; thicknessM: number; temperatureC?: number }) => number>();
    expectTypeOf(calc.ipc2221MaxCurrent).toEqualTypeOf<(p: { widthM: number; thicknessM: number; temperatureRiseC: number; layer: Layer }) => number>();
    expectTypeOf(calc.decodeResistorMarking).toEqualTypeOf<(code: string) => number>();
    expectTypeOf(calc.decodeCapacitorMarking).toEqualTypeOf<(code: string) => number>();
    // decodeColorBands also reports the temperature coefficient of 6-band parts.
    expectTypeOf(calc.decodeColorBands).toExtend<(colors: string[]) => { ohms: number; tolerancePercent?: number }>();
    expectTypeOf(calc.decodeColorBands).parameters.toEqualTypeOf<[colors: string[]]>();
    expectTypeOf(calc.nearestPreferredValue).toEqualTypeOf<(value: number, series: 'E6' | 'E12' | 'E24' | 'E48' | 'E96' | 'E192') => number>();
    // burnThresholdC also takes coated metal and wood (issue 10); it accepts every contract call.
    expectTypeOf(calc.burnThresholdC).toExtend<(p: { material: 'metal' | 'glass' | 'plastic'; contactSeconds: number }) => number>();
    expectTypeOf(calc.surfaceTemperatureRiseC).toEqualTypeOf<(p: { watts: number; areaM2: number; hWPerM2K?: number }) => number>();
    // integrateRun also reports the time-weighted mean voltage.
    expectTypeOf(calc.integrateRun).toExtend<(samples: { t: number; v: number; i: number }[]) => { ampHours: number; wattHours: number; durationS: number; averageVolts: number }>();
    expectTypeOf(calc.integrateRun).parameters.toEqualTypeOf<[samples: { t: number; v: number; i: number }[]]>();
    expectTypeOf(calc.unitPriceAtQuantity).toEqualTypeOf<(breaks: { minQty: number; unitPrice: number }[], qty: number) => number>();
    expectTypeOf(calc.convertCurrency).toEqualTypeOf<(amount: number, from: string, to: string, table: { base: string; rates: Record<string, number> }) => number>();
    expectTypeOf(calc.paretoFrontier).toEqualTypeOf<(points: { id: string; cost: number; benefit: number }[]) => string[]>();
    expect(Object.keys(CONTRACT)).toHaveLength(25);
  });

  it('what later issues need is exported too', () => {
    for (const name of [
      'chargeTimeHours',
      'labelCapacityPlausibility',
      'ipc2221MinWidth',
      'powerDensityWPerCm2',
      'dutyForTargetTemperatureRise',
      'analyseCharge',
      'analyseThermal',
      'rollUpCost',
      'costAtVolumes',
      'landedCost',
      'comparisonMetrics',
      'weightedScores',
      'teardownFigures',
      'explainMarking',
      'heaterTraceReport',
      'runtimeReport',
      'decodeToleranceLetter',
    ]) {
      expect(typeof (calc as unknown as Record<string, unknown>)[name], name).toBe('function');
    }
  });
});
