import { describe, it, expect } from 'vitest';
import { FORMULAS, formulaOf } from './formulas';

describe('formula catalogue', () => {
  it('has the figure families the teardown figures use, each with a formula and a labelled source', () => {
    for (const key of [
      'load.power',
      'load.elementPower',
      'load.current',
      'load.averagePower',
      'pack.energy',
      'pack.transportClass',
      'pack.specificEnergy',
      'pack.cRate',
      'runtime.hours',
      'powerbank.outputAh',
      'charge.timeHours',
      'heater.powerDensity',
      'heater.surfaceRise',
      'heater.touchMargin',
      'capacity.measuredVsLabel',
      'trace.rating',
      'trace.resistance',
    ]) {
      expect(FORMULAS[key], key).toBeDefined();
    }
    for (const [key, entry] of Object.entries(FORMULAS)) {
      expect(entry.formula.length, key).toBeGreaterThan(0);
      expect(entry.source, key).toMatch(/\[(C|CP|M|S)[\]:;, ]/);
    }
  });
  it("load power is P = V² / R_eq by Joule's law [C]", () => {
    expect(formulaOf('load.power')).toEqual({ formula: 'P = V² / R_eq, R_eq = n·R (series) or R/n (parallel)', source: "Joule's law [C]" });
    expect(FORMULAS['no.such.key']).toBeUndefined();
  });
});
