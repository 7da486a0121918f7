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
      // bench tools and the rest of the package (every figure family has an entry)
      'trace.minWidth',
      'trace.sheetResistance',
      'thermal.surfaceRise',
      'thermal.burnThreshold',
      'thermal.dutyForRise',
      'electrical.powerFromCurrent',
      'electrical.voltageDrop',
      'pack.current',
      'pack.loadFromCurrent',
      'marking.resistor',
      'marking.eia96',
      'marking.letterCode',
      'marking.jumper',
      'marking.capacitor',
      'marking.capacitorLetter',
      'marking.tolerance',
      'marking.colourBands',
      'marking.nearestPreferred',
      'run.integration',
      'run.averageVolts',
      'run.cutoff',
      'run.chargePhases',
      'run.steadyState',
      'cost.unitPrice',
      'cost.currency',
      'cost.rollUp',
      'cost.landed',
      'cost.margin',
      'cost.impliedMargin',
      'compare.whPerCurrency',
      'compare.pareto',
      'compare.weightedScore',
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

describe('formula entries match the references', () => {
  it('IPC-2221: k 0.048 external, 0.024 internal, exponents 0.44 and 0.725, mil² [S]', () => {
    expect(formulaOf('trace.rating').formula).toMatch(/k · ΔT\^0\.44 · \(w·t\)\^0\.725, k = 0\.048 external \/ 0\.024 internal, mil²/);
  });
  it('runtime = energy × efficiency × usable fraction ÷ load power (REFERENCES decisions) [C]', () => {
    expect(formulaOf('runtime.hours').formula).toMatch(/^t = E · η · u \/ P/);
  });
  it('trapezoidal integration multiplies V·I per sample (REFERENCES §8) [S]', () => {
    expect(formulaOf('run.integration').formula).toMatch(/V_k·I_k/);
  });
});
