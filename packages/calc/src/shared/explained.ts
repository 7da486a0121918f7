/** A figure with what the UI needs to show how it was obtained. */
export interface FigureInput {
  label: string;
  value: number | string | boolean | null;
  unit?: string;
}

export interface Explained<T = number> {
  value: T;
  unit: string;
  formula: string;
  source: string;
  inputs: FigureInput[];
  assumptions: string[];
  warnings: string[];
}
