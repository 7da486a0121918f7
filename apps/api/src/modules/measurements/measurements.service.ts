import { MEASURED_QUANTITY, MEASUREMENT_FIELDS, SI_UNIT, type MeasuredQuantity, type MeasurementDto } from '@splitcase/contracts';
import { validationError } from '../../http/errors';
import { toCsv } from '../../lib/csv';
import { readNumber, readQuantity, QuantityError } from '../../lib/units';
import type { Measurement } from './measurement.entity';

export function toMeasurementDto(m: Measurement): MeasurementDto {
  return {
    id: m.id,
    teardownId: typeof m.teardown === 'object' ? m.teardown.id : (m.teardown as number),
    quantity: m.quantity,
    value: Number(m.value),
    unit: m.unit,
    entered: m.entered,
    subject: m.subject,
    conditions: m.conditions ?? null,
    instrument: m.instrument ?? null,
    uncertainty: m.uncertainty ?? null,
    takenBy: m.takenBy ? { id: m.takenBy.id, name: m.takenBy.name } : null,
    takenAt: m.takenAt.toISOString(),
  };
}

/**
 * A reading typed with its unit, read as the chosen quantity ("3.02 Ω" as a resistance). A unit of
 * another quantity is refused, naming the field. A bare number typed as text follows the quantity's
 * example (a voltage in V, a mass in g; a current needs its unit); a JSON number is in the stored
 * unit. "Other" keeps the number and the unit as typed.
 */
export function readMeasuredValue(quantity: MeasuredQuantity, value: string | number): { value: number; unit: string; entered: string } {
  const entered = String(value).trim();
  if (quantity === 'other') {
    const m = entered.match(/^([-+\u2212]?[\d.,\s]*\d)\s*(\D.{0,11})?$/);
    let n: number | null = null;
    try {
      n = m ? readNumber(m[1]!) : null;
    } catch {
      n = null;
    }
    if (n === null) throw validationError({ value: 'Enter a number, then its unit if it has one (e.g. "1200 rpm")' });
    return { value: n, unit: (m![2] ?? '').trim(), entered };
  }
  try {
    const q = readQuantity(value, MEASUREMENT_FIELDS[quantity]);
    return { value: q.value, unit: SI_UNIT[quantity], entered };
  } catch (err) {
    if (err instanceof QuantityError) throw validationError({ value: `${err.message} — the quantity is ${MEASURED_QUANTITY.labels[quantity].toLowerCase()}` });
    throw err;
  }
}

export function measurementsCsv(rows: Measurement[]): string {
  return toCsv(
    ['Quantity', 'Value', 'Unit', 'As entered', 'What was measured', 'Conditions', 'Instrument', 'Uncertainty', 'Taken by', 'Taken at (UTC)'],
    rows.map((m) => [
      MEASURED_QUANTITY.labels[m.quantity],
      m.value,
      m.unit,
      m.entered,
      m.subject,
      m.conditions ?? null,
      m.instrument ?? null,
      m.uncertainty ?? null,
      m.takenBy?.name ?? null,
      m.takenAt.toISOString(),
    ]),
  );
}
