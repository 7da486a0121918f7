import type { Explained, FigureInput } from '../shared/explained';
import { formulaOf, type FormulaKey } from '../figures/formulas';

/** One result of a bench tool: an explained figure with a key and a label for the UI. */
export interface BenchFigure extends Explained<number | string> {
  key: string;
  label: string;
}

/** A bench figure whose formula and source come from the FORMULAS catalogue. */
export function benchFigure(p: {
  key: string;
  label: string;
  value: number | string;
  unit: string;
  formulaKey: FormulaKey;
  inputs: FigureInput[];
  assumptions?: string[];
  warnings?: string[];
}): BenchFigure {
  const { formula, source } = formulaOf(p.formulaKey);
  return {
    key: p.key,
    label: p.label,
    value: p.value,
    unit: p.unit,
    formula,
    source,
    inputs: p.inputs,
    assumptions: p.assumptions ?? [],
    warnings: p.warnings ?? [],
  };
}
