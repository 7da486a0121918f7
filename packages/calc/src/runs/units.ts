/**
 * Units of bench-log columns and their linear conversion to the stored unit
 * (s, V, A, W, °C): stored = logged × scale + offset.
 * Factors [S: NIST SP 811, Guide for the Use of the SI, Appendix B]: 1 min = 60 s,
 * 1 h = 3600 s, milli = 10⁻³; t/°C = (t/°F − 32)/1.8.
 */
export type RunQuantity = 'time' | 'voltage' | 'current' | 'power' | 'temperature';

/** Elapsed-time units a log may use (timestamps are turned into elapsed seconds before conversion). */
export const RUN_TIME_UNITS = ['ms', 's', 'min', 'h'] as const;
export const RUN_VOLTAGE_UNITS = ['mV', 'V'] as const;
export const RUN_CURRENT_UNITS = ['mA', 'A'] as const;
export const RUN_POWER_UNITS = ['mW', 'W'] as const;
export const RUN_TEMPERATURE_UNITS = ['°C', '°F'] as const;

export const RUN_STORED_UNIT: Record<RunQuantity, string> = { time: 's', voltage: 'V', current: 'A', power: 'W', temperature: '°C' };

const CONVERSIONS: Record<RunQuantity, Record<string, { scale: number; offset: number }>> = {
  time: { ms: { scale: 1e-3, offset: 0 }, s: { scale: 1, offset: 0 }, min: { scale: 60, offset: 0 }, h: { scale: 3600, offset: 0 } },
  voltage: { mV: { scale: 1e-3, offset: 0 }, V: { scale: 1, offset: 0 } },
  current: { mA: { scale: 1e-3, offset: 0 }, A: { scale: 1, offset: 0 } },
  power: { mW: { scale: 1e-3, offset: 0 }, W: { scale: 1, offset: 0 } },
  temperature: { '°C': { scale: 1, offset: 0 }, '°F': { scale: 1 / 1.8, offset: -32 / 1.8 } },
};

/** The linear map from a logged unit to the stored unit of its quantity; throws a RangeError naming the unit. */
export function runUnitConversion(quantity: RunQuantity, unit: string): { scale: number; offset: number; storedUnit: string } {
  const table = CONVERSIONS[quantity];
  if (!table) throw new RangeError(`Unknown quantity "${String(quantity)}" for a bench-log column.`);
  const c = table[unit];
  if (!c) {
    throw new RangeError(`A ${quantity} column can be in ${Object.keys(table).join(', ')} (got "${String(unit)}").`);
  }
  return { ...c, storedUnit: RUN_STORED_UNIT[quantity] };
}

/** Converts one logged value to the stored unit. */
export function toStoredUnit(quantity: RunQuantity, unit: string, value: number): number {
  const { scale, offset } = runUnitConversion(quantity, unit);
  return value * scale + offset;
}

/** Converts a column in place (no copy: a million-sample column stays one array). Returns the same array. */
export function convertColumnInPlace(column: Float64Array, quantity: RunQuantity, unit: string): Float64Array {
  const { scale, offset } = runUnitConversion(quantity, unit);
  if (scale === 1 && offset === 0) return column;
  for (let k = 0; k < column.length; k++) column[k] = (column[k] as number) * scale + offset;
  return column;
}
