// Measured capacity against the label, compared in Wh: labels quote mAh at the cell's nominal
// voltage whatever the series count (REFERENCES §5 [CP]), so the label's Ah is turned into Wh at
// the cell voltage and the measured charge at the pack voltage.
import { labelEnergyWh } from '../battery/index';
import { figure, inp, num } from './build';
import type { FigureContext } from './context';

/** The label's energy and how it was read (battery/label.ts); the cell rating when the label is silent. */
export function labelEnergy(ctx: FigureContext): { wh: number; basis: string; fromLabel: boolean } | undefined {
  const { claims, pack } = ctx;
  if (claims.capacityWh !== undefined && !pack) return { wh: claims.capacityWh, basis: 'energy claimed on the device label', fromLabel: true };
  if (!pack) return undefined;
  const onLabel = labelEnergyWh(claims, pack.p.cellNominalVolts);
  if (onLabel) {
    return {
      wh: onLabel.wh,
      basis:
        onLabel.basis === 'label-wh'
          ? 'energy claimed on the device label'
          : `capacity claimed on the device label × the cell nominal voltage ${num(pack.p.cellNominalVolts)} V (labels quote mAh at the cell voltage)`,
      fromLabel: true,
    };
  }
  return { wh: pack.energyWh, basis: 'rated energy of the cells', fromLabel: false };
}

export interface CapacityOutcome {
  ratio?: number;
  labelBasis: string;
}

export function capacityFigures(ctx: FigureContext): CapacityOutcome {
  const { pack, input } = ctx;
  const label = labelEnergy(ctx);
  const md = input.measuredDischarge;
  let measured: { wh: number; ah?: number; basis: string } | undefined;
  if (md?.wattHours !== undefined && md.wattHours > 0) measured = { wh: md.wattHours, ah: md.ampHours, basis: `energy delivered in the ${md.basis}` };
  else if (pack) {
    const ah = md && md.ampHours > 0 ? md.ampHours : (input.measuredCapacityAh ?? (pack.p.cellMeasuredAh !== undefined ? pack.p.cellMeasuredAh * pack.p.parallel : undefined));
    if (ah !== undefined) measured = { wh: ah * pack.volts, ah, basis: `measured capacity × the pack nominal ${num(pack.volts)} V` };
  }
  if (!label || !measured) return { labelBasis: label?.basis ?? '' };
  const ratio = measured.wh / label.wh;
  ctx.figures.push(
    figure({
      key: 'capacity.measuredVsLabel',
      label: 'Measured capacity against the label',
      value: ratio * 100,
      unit: '%',
      family: 'capacity.measuredVsLabel',
      inputs: [
        inp('measuredWh', 'Measured energy', measured.wh, 'Wh'),
        ...(measured.ah !== undefined ? [inp('measuredAh', 'Measured capacity', measured.ah, 'Ah')] : []),
        inp('labelWh', 'Label energy', label.wh, 'Wh'),
        ...(ctx.claims.capacityAh !== undefined ? [inp('labelAh', 'Label capacity', ctx.claims.capacityAh, 'Ah')] : []),
        inp('labelBasis', 'Label read as', label.basis),
        inp('measuredBasis', 'Measured as', measured.basis),
      ],
      assumptions: [`Label: ${label.basis}.`, `Measured: ${measured.basis}, at the pack terminals.`, 'Compared in Wh, so a series pack labelled in mAh is read right.'],
      warnings:
        ratio < ctx.warnFraction
          ? [`Measured capacity is ${num(ratio * 100)} % of the label, below the ${num(ctx.warnFraction * 100)} % warning level.`]
          : ratio > 1.3
            ? [`Measured ${num(ratio * 100)} % of the label: more than a cell delivers over its rating; check the run's current column and the label.`]
            : [],
      implausible: ratio > 1.3,
    }),
  );
  return { ratio, labelBasis: label.basis };
}
