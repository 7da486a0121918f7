import { requireInteger, requirePositive } from '../shared/validate';
import { requireConnection, type Connection } from './ohms-law';

/**
 * A load made of identical elements. Give one of resistanceOhms, currentAmps or
 * powerWatts, each per element at its operating point when the whole load is
 * fed at supplyVolts. If several are given, resistance wins, then current, then power.
 */
export interface LoadElementsInput {
  count: number;
  connection: Connection;
  resistanceOhms?: number;
  currentAmps?: number;
  powerWatts?: number;
  supplyVolts: number;
}

export interface LoadPowerResult {
  /** Which description of the element the result was computed from. */
  basis: 'resistance' | 'current' | 'power';
  /** Resistance of one element at its operating point (Ω). */
  elementOhms: number;
  /** Equivalent resistance of the whole load (Ω). */
  equivalentOhms: number;
  /** Voltage across one element (V). */
  elementVolts: number;
  /** Current through one element (A). */
  elementAmps: number;
  /** Power in one element (W). */
  elementWatts: number;
  /** Current drawn by the whole load from the supply (A). */
  totalAmps: number;
  /** Power of the whole load (W). */
  totalWatts: number;
}

/** Element and total resistance, current and power of a load of identical elements in series or parallel at a supply voltage. */
export function loadPower(p: LoadElementsInput): LoadPowerResult {
  const count = requireInteger(p.count, 'Element count');
  const connection = requireConnection(p.connection, 'Element connection');
  const supplyVolts = requirePositive(p.supplyVolts, 'Supply voltage (V)');
  const elementVolts = connection === 'series' ? supplyVolts / count : supplyVolts;

  let basis: LoadPowerResult['basis'];
  let elementOhms: number;
  if (p.resistanceOhms !== undefined) {
    basis = 'resistance';
    elementOhms = requirePositive(p.resistanceOhms, 'Element resistance (Ω)');
  } else if (p.currentAmps !== undefined) {
    basis = 'current';
    elementOhms = elementVolts / requirePositive(p.currentAmps, 'Element current (A)');
  } else if (p.powerWatts !== undefined) {
    basis = 'power';
    elementOhms = (elementVolts * elementVolts) / requirePositive(p.powerWatts, 'Element power (W)');
  } else {
    throw new RangeError('A load needs its element resistance (Ω), current (A) or power (W).');
  }

  const equivalentOhms = connection === 'series' ? elementOhms * count : elementOhms / count;
  const elementAmps = elementVolts / elementOhms;
  const elementWatts = elementVolts * elementAmps;
  const totalAmps = supplyVolts / equivalentOhms;
  const totalWatts = (supplyVolts * supplyVolts) / equivalentOhms;
  return { basis, elementOhms, equivalentOhms, elementVolts, elementAmps, elementWatts, totalAmps, totalWatts };
}
