/**
 * Label capacity against what the bench measured, in energy. Device labels quote mAh at the cell's
 * nominal voltage whatever the series count [CP: REFERENCES §5, "rated mAh is quoted at cell
 * voltage"], so a 2S pack of 5 Ah cells is labelled "10 000 mAh" while its terminals deliver 5 Ah.
 * Comparing Ah with Ah would halve such a pack; comparing Wh with Wh does not.
 */
import { requireFraction, requireNonNegative, requirePositive } from '../shared/validate';

export interface LabelCapacity {
  capacityAh?: number;
  capacityWh?: number;
}

/** Where a label energy comes from: the label's own Wh, or its Ah × the cell nominal voltage. */
export type LabelEnergyBasis = 'label-wh' | 'label-ah-at-cell-volts';
/** Where a measured energy comes from: the run's Wh, or its Ah × the pack nominal voltage. */
export type MeasuredEnergyBasis = 'measured-wh' | 'measured-ah-at-pack-volts';

/** Default share of the label below which a measured energy is flagged [CP]. */
export const LABEL_WARN_FRACTION = 0.9;

const given = (x: number | null | undefined): x is number => x !== undefined && x !== null;

/** The label's energy: its Wh when given, else its Ah × the cell nominal voltage (labels quote mAh at the cell voltage whatever the series count). */
export function labelEnergyWh(label: LabelCapacity, cellNominalVolts: number): { wh: number; basis: LabelEnergyBasis } | undefined {
  if (label === null || typeof label !== 'object') throw new RangeError('label must be an object with capacityAh and/or capacityWh.');
  if (given(label.capacityWh)) return { wh: requirePositive(label.capacityWh, 'Energy on the label (Wh)'), basis: 'label-wh' };
  if (given(label.capacityAh)) {
    const ah = requirePositive(label.capacityAh, 'Capacity on the label (Ah)');
    return { wh: ah * requirePositive(cellNominalVolts, 'Cell nominal voltage (V)'), basis: 'label-ah-at-cell-volts' };
  }
  return undefined;
}

/** Measured against the label in Wh: measured Wh when given, else measured Ah × pack nominal voltage. */
export function measuredVersusLabelEnergy(input: {
  measuredWh?: number;
  measuredAh?: number;
  packNominalVolts: number;
  cellNominalVolts: number;
  label: LabelCapacity;
  warnFraction?: number;
}): { ratio: number; measuredWh: number; labelWh: number; labelBasis: LabelEnergyBasis; measuredBasis: MeasuredEnergyBasis; warning: boolean } | undefined {
  const warnFraction = requireFraction(input.warnFraction ?? LABEL_WARN_FRACTION, 'warnFraction');
  let measuredWh: number;
  let measuredBasis: MeasuredEnergyBasis;
  if (given(input.measuredWh)) {
    measuredWh = requireNonNegative(input.measuredWh, 'Measured energy (Wh)');
    measuredBasis = 'measured-wh';
  } else if (given(input.measuredAh)) {
    measuredWh = requireNonNegative(input.measuredAh, 'Measured capacity (Ah)') * requirePositive(input.packNominalVolts, 'Pack nominal voltage (V)');
    measuredBasis = 'measured-ah-at-pack-volts';
  } else {
    throw new RangeError('Give the measured energy (Wh) or the measured capacity (Ah) to compare with the label.');
  }
  const label = labelEnergyWh(input.label, input.cellNominalVolts);
  if (!label) return undefined;
  const ratio = measuredWh / label.wh;
  return { ratio, measuredWh, labelWh: label.wh, labelBasis: label.basis, measuredBasis, warning: ratio < warnFraction };
}
