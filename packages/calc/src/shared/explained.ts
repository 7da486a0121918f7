/** A figure with what the UI needs to show how it was obtained. */
export interface FigureInput {
  /** Stable name of the input within its figure (teardown figures always set it). */
  key?: string;
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
