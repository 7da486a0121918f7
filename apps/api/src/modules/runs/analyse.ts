// Analysis of a parsed run through packages/calc, and its comparison with the label. The API never
// computes a figure itself: it picks the calc functions, their inputs, and says what it assumed.
import {
  analyseCharge,
  analyseDischarge,
  analysePowerBank,
  analyseThermal,
  burnThresholdDetail,
  capacityVersusLabel,
  DEFAULT_TERMINATION_FRACTION,
  FIGURE_DEFAULTS,
  integrateSeries,
  labelEnergyWh,
  measuredVersusLabelEnergy,
  packEnergyWh,
  timeToTemperature,
  type SurfaceMaterial,
} from '@splitcase/calc';
import type { RunAnalysis, RunComparison, RunKind, RunOptions } from '@splitcase/contracts';
import { AppError } from '../../http/errors';
import type { StoredSeries } from './storage';

/** What the analysis needs to know about the teardown beyond the log. */
export interface AnalysisContext {
  device: { claimCapacityAh: number | null; claimCapacityWh: number | null };
  pack: { cellNominalVolts: number; cellRatedAh: number; series: number; parallel: number } | null;
  /** Surface material of the teardown's heater load, when recorded. */
  heaterMaterial: SurfaceMaterial | null;
  /** Energy the cells delivered in the latest discharge run of the same teardown, when there is one. */
  measuredCells: { wattHours: number; label: string } | null;
  /** Contact time of the teardown, else the workspace default (s). */
  teardownContactSeconds: number | null;
  defaultContactSeconds: number;
  /** Workspace setting: how long a discharge must stay at or below its cut-off to end (s). */
  cutoffDebounceSeconds: number;
}

/** Nominal voltage assumed for a label that gives only Ah (Li-ion, REFERENCES §4) [S]. */
export const ASSUMED_LABEL_VOLTS = 3.7;
/** Output energy of a power bank below this share of its label energy is flagged: η is typically 0.80–0.90 (REFERENCES §5) [CP]. */
export const POWER_BANK_MIN_OUTPUT_SHARE = 0.8;

const fmt = (x: number, digits = 3) => Number(x.toPrecision(digits)).toString();
const hms = (s: number) => {
  const h = Math.floor(s / 3600);
  const m = Math.round((s - h * 3600) / 60);
  return h > 0 ? `${h} h ${m} min` : `${m} min`;
};

/** The label's claims as calc takes them (absent rather than null). */
const labelOf = (ctx: AnalysisContext) => ({ capacityAh: ctx.device.claimCapacityAh ?? undefined, capacityWh: ctx.device.claimCapacityWh ?? undefined });

/** The cell nominal voltage a label in mAh is quoted at: the pack record's cell, else 3.7 V assumed; in words too. */
function labelCellVolts(ctx: AnalysisContext): { volts: number; words: string } {
  if (ctx.pack) return { volts: ctx.pack.cellNominalVolts, words: `${fmt(ctx.pack.cellNominalVolts)} V cell nominal (pack record)` };
  return { volts: ASSUMED_LABEL_VOLTS, words: `${ASSUMED_LABEL_VOLTS} V cell nominal (assumed: no pack record)` };
}

/** The label energy in words: its Wh, or its Ah × the cell voltage. */
function labelWords(basis: 'label-wh' | 'label-ah-at-cell-volts', wh: number, ctx: AnalysisContext): string {
  if (basis === 'label-wh') return `the ${fmt(wh)} Wh on the label`;
  const inSeries = ctx.pack && ctx.pack.series > 1 ? ` (labels quote mAh at the cell voltage: the ${ctx.pack.series} cells in series raise the voltage, not the mAh)` : '';
  return `the label's ${fmt(ctx.device.claimCapacityAh!)} Ah × ${labelCellVolts(ctx).words} = ${fmt(wh)} Wh${inSeries}`;
}

function optionError(field: string, message: string): AppError {
  return new AppError('unprocessable', message, { [`options.${field}`]: message });
}

/**
 * Cell energy for a power-bank run: the option; else what the cells delivered in a discharge run of
 * the same unit (so the efficiency is the conversion alone, not a weak cell as well); else the pack
 * record's rating; else the label.
 */
export function cellEnergy(options: RunOptions, ctx: AnalysisContext): { wh: number; source: string } {
  if (options.cellEnergyWh) return { wh: options.cellEnergyWh, source: `value given with the run: ${fmt(options.cellEnergyWh)} Wh` };
  if (ctx.measuredCells && ctx.measuredCells.wattHours > 0) {
    return { wh: ctx.measuredCells.wattHours, source: `discharge run of this unit ("${ctx.measuredCells.label}"): ${fmt(ctx.measuredCells.wattHours)} Wh delivered by the cells` };
  }
  if (ctx.pack) {
    const { cellNominalVolts, cellRatedAh, series, parallel } = ctx.pack;
    const wh = packEnergyWh({ cellNominalVolts, cellCapacityAh: cellRatedAh, series, parallel });
    return { wh, source: `pack record: ${series}S${parallel}P of ${fmt(cellNominalVolts)} V × ${fmt(cellRatedAh)} Ah cells = ${fmt(wh)} Wh` };
  }
  const label = labelEnergyWh(labelOf(ctx), ASSUMED_LABEL_VOLTS);
  if (label?.basis === 'label-wh') return { wh: label.wh, source: `label energy: ${fmt(label.wh)} Wh` };
  if (label) return { wh: label.wh, source: `label capacity ${fmt(ctx.device.claimCapacityAh!)} Ah × ${ASSUMED_LABEL_VOLTS} V (nominal voltage assumed) = ${fmt(label.wh)} Wh` };
  throw optionError('cellEnergyWh', 'Give the energy of the cells (Wh): the teardown has no pack record and the label states no capacity.');
}

/** Runs the calc analysis for the kind of run; RangeErrors from calc name the input (422). */
export function analyseRun(kind: RunKind, series: StoredSeries, options: RunOptions, ctx: AnalysisContext): RunAnalysis {
  const samples = series.t.length;
  const notes: string[] = [];
  const warnings: string[] = [];
  const base = { samples, notes, warnings };

  if (kind === 'discharge') {
    const cutoffVolts = options.cutoffVolts ?? undefined;
    const debounce =
      options.cutoffDebounceSeconds !== undefined && options.cutoffDebounceSeconds !== null
        ? { seconds: options.cutoffDebounceSeconds, source: 'run' as const }
        : { seconds: ctx.cutoffDebounceSeconds, source: 'workspace' as const };
    const debounceWords = `${fmt(debounce.seconds)} s (${debounce.source === 'run' ? 'set for this run' : 'workspace setting'})`;
    const r = analyseDischarge(series, { cutoffVolts, cutoffDebounceSeconds: debounce.seconds });
    if (cutoffVolts === undefined) notes.push('No cut-off voltage given: the totals run until the load stops (or to the end of the log).');
    else if (r.cutoff) {
      notes.push(
        debounce.seconds > 0
          ? `Totals up to the first sample at or below the ${fmt(cutoffVolts)} V cut-off that stayed there for ${debounceWords} (or until the load stopped or the log ended), after ${hms(r.cutoff.t)}.`
          : `Totals up to the first sample at or below the ${fmt(cutoffVolts)} V cut-off, after ${hms(r.cutoff.t)} (no debounce: ${debounceWords}).`,
      );
    } else {
      notes.push(`The log never stays at the ${fmt(cutoffVolts)} V cut-off for ${debounceWords}: the totals cover the whole log.`);
      warnings.push(`The voltage never fell to the ${fmt(cutoffVolts)} V cut-off for good (lowest ${fmt(r.minVolts)} V): the cell may not be fully discharged, so the capacity is a lower bound.`);
    }
    if (r.ignoredDips) {
      const d = r.ignoredDips;
      notes.push(
        `${d.count === 1 ? 'One sag' : `${d.count} sags`} below the cut-off shorter than ${fmt(debounce.seconds)} s ${d.count === 1 ? 'was' : 'were'} ignored (the first after ${hms(d.firstAtS)}, the longest ${fmt(d.longestS)} s), as at a load step.`,
      );
    }
    if (!series.i) notes.push('Current worked out as power ÷ voltage per sample.');
    const pulse = r.internalResistance;
    if (pulse) {
      notes.push(
        `DC resistance from the current step after ${hms(pulse.atSeconds)}: ${fmt(pulse.lowAmps)} A at ${fmt(pulse.lowVolts, 4)} V just before it, ${fmt(pulse.highAmps)} A at ${fmt(pulse.highVolts, 4)} V ${fmt(pulse.readAtSeconds - (series.t[pulse.lowIndex] as number))} s after the last low-current sample: (U₁ − U₂) / (I₂ − I₁) = ${fmt(pulse.ohms * 1000)} mΩ at the pack terminals (wiring and protection included).`,
      );
    }
    return {
      ...base,
      ampHours: r.ampHours,
      wattHours: r.wattHours,
      durationS: r.durationS,
      averageVolts: r.averageVolts,
      endVolts: r.endVolts,
      discharge: {
        cutoffVolts: cutoffVolts ?? null,
        cutoff: r.cutoff,
        minVolts: r.minVolts,
        timeAverageVolts: r.timeAverageVolts,
        averageCurrentA: r.averageCurrentA,
        averagePowerW: r.averagePowerW,
        analysedToS: series.t[r.endIndex] as number,
        cutoffDebounce: debounce,
        ignoredDips: r.ignoredDips,
        meanSquareVolts: r.meanSquareVolts,
        internalResistance: pulse
          ? { ohms: pulse.ohms, lowAmps: pulse.lowAmps, lowVolts: pulse.lowVolts, highAmps: pulse.highAmps, highVolts: pulse.highVolts, atSeconds: pulse.atSeconds, readAtSeconds: pulse.readAtSeconds }
          : null,
      },
    };
  }

  if (kind === 'charge') {
    const terminationFraction = options.terminationFraction ?? DEFAULT_TERMINATION_FRACTION;
    const ratedAh = ctx.pack ? ctx.pack.cellRatedAh * ctx.pack.parallel : undefined;
    let r: ReturnType<typeof analyseCharge>;
    try {
      r = analyseCharge(series, { cvVolts: options.cvVolts ?? undefined, terminationFraction, ratedCapacityAh: ratedAh });
    } catch (err) {
      // A termination at or above the charger's current: name the field as the form labels it.
      if (err instanceof RangeError && err.message.startsWith('terminationFraction: ')) throw optionError('terminationFraction', err.message.replace(/^terminationFraction: /, 'Termination (C): '));
      throw err;
    }
    if (options.cvVolts === undefined || options.cvVolts === null) notes.push(`Charge voltage estimated from the top of the log: ${fmt(r.plateauVolts, 4)} V.`);
    const ratedWords = ctx.pack && ctx.pack.parallel > 1 ? `${ctx.pack.parallel} cells of ${fmt(ctx.pack.cellRatedAh)} Ah in parallel, pack record` : 'pack record';
    const description =
      r.terminationBasis === 'rated-capacity'
        ? `${fmt(terminationFraction)} C of the rated ${fmt(ratedAh!)} Ah (${ratedWords}) = ${fmt(r.terminationCurrentA)} A`
        : `${fmt(terminationFraction * 100)} % of the ${fmt(r.cc.currentA)} A constant current = ${fmt(r.terminationCurrentA)} A (no pack record gives a rated capacity)`;
    notes.push(`Termination at ${description}.`);
    if (!r.terminated) warnings.push('The current never fell to the termination current: the log may stop before the charge ended.');
    if (r.transitionIndex === null) warnings.push('No constant-voltage phase found: the voltage never held at the plateau while the current fell.');
    return {
      ...base,
      ampHours: r.ampHours,
      wattHours: r.wattHours,
      durationS: r.chargeTimeS,
      averageVolts: r.ampHours > 0 ? r.wattHours / r.ampHours : null,
      endVolts: series.v ? (series.v[r.endIndex] as number) : null,
      charge: {
        cc: r.cc,
        cv: r.cv,
        transitionS: r.transitionIndex === null ? null : (series.t[r.transitionIndex] as number),
        terminationCurrentA: r.terminationCurrentA,
        terminationFraction,
        termination: { basis: r.terminationBasis, ratedAh: ratedAh ?? null, description },
        terminated: r.terminated,
        chargeTimeS: r.chargeTimeS,
        plateauVolts: r.plateauVolts,
      },
    };
  }

  if (kind === 'thermal') {
    let material: SurfaceMaterial;
    if (options.material) material = options.material;
    else if (ctx.heaterMaterial) {
      material = ctx.heaterMaterial;
      notes.push(`Surface material from the heater record: ${material}.`);
    } else {
      material = FIGURE_DEFAULTS.surfaceMaterial;
      notes.push(`Surface material not given: ${material} assumed (the stricter choice for short contact).`);
    }
    let contactSeconds: number;
    if (options.contactSeconds) contactSeconds = options.contactSeconds;
    else if (ctx.teardownContactSeconds) {
      contactSeconds = ctx.teardownContactSeconds;
      notes.push(`Contact time from the teardown: ${contactSeconds} s.`);
    } else {
      contactSeconds = ctx.defaultContactSeconds;
      notes.push(`Contact time from the workspace setting: ${contactSeconds} s.`);
    }
    const burn = burnThresholdDetail({ material, contactSeconds });
    const r = analyseThermal(series, { thresholdC: options.thresholdC ?? undefined, burnThresholdC: burn.thresholdC, material, contactSeconds });
    const toBurn = timeToTemperature(series, burn.thresholdC);
    const marginC = r.marginC as number;
    if (marginC < 0) {
      warnings.push(`The surface reached ${fmt(r.maxC)} °C, ${fmt(-marginC, 2)} °C above the ${burn.thresholdC} °C burn threshold for ${contactSeconds} s contact with ${material}.`);
    }
    if (!r.steadyState.reached) notes.push('No steady state within the log: the surface was still warming or cooling at the end.');
    const hasEnergy = Boolean(series.i || series.p);
    const totals = hasEnergy ? integrateSeries(series) : null;
    return {
      ...base,
      ampHours: totals?.ampHours ?? null,
      wattHours: totals?.wattHours ?? null,
      durationS: (series.t[samples - 1] as number) - (series.t[0] as number),
      averageVolts: totals?.averageVolts ?? null,
      endVolts: series.v ? (series.v[samples - 1] as number) : null,
      thermal: {
        startC: series.temp![0] as number,
        maxC: r.maxC,
        maxAtS: r.maxAtS,
        thresholdC: options.thresholdC ?? null,
        timeToThresholdS: r.timeToThresholdS,
        steadyState: {
          reached: r.steadyState.reached,
          temperatureC: r.steadyState.temperatureC,
          fromS: r.steadyState.fromS,
          toS: r.steadyState.toS,
          criterion: r.steadyState.criterion,
        },
        burnThreshold: { temperatureC: burn.thresholdC, material, contactSeconds, listedSeconds: burn.listedSeconds, source: burn.source },
        marginC,
        timeToBurnThresholdS: toBurn,
      },
    };
  }

  // Power-bank output.
  const energy = cellEnergy(options, ctx);
  const r = analysePowerBank(series, { cellEnergyWh: energy.wh });
  notes.push(`Cell energy from the ${energy.source}.`);
  warnings.push(...r.warnings);
  return {
    ...base,
    ampHours: r.ampHours,
    wattHours: r.wattHours,
    durationS: r.durationS,
    averageVolts: r.averageVolts,
    endVolts: series.v ? (series.v[samples - 1] as number) : null,
    powerBank: { ampHoursAt5V: r.ampHoursAt5V, cellEnergyWh: r.cellEnergyWh, cellEnergySource: energy.source, efficiency: r.efficiency },
  };
}

/** Measured against the label (in Wh) and the rated cells (in Ah), with the workspace's warning threshold. */
export function compareRun(kind: RunKind, analysis: RunAnalysis, ctx: AnalysisContext, warnFraction: number): RunComparison {
  const out: RunComparison = { warnBelowPercent: warnFraction * 100, label: null, rated: null, labelEnergy: null };
  const cell = labelCellVolts(ctx);
  if (kind === 'discharge' && analysis.ampHours !== null) {
    const measuredAh = analysis.ampHours;
    const packVolts = ctx.pack ? ctx.pack.cellNominalVolts * ctx.pack.series : ASSUMED_LABEL_VOLTS;
    const c = measuredVersusLabelEnergy({
      measuredWh: analysis.wattHours ?? undefined,
      measuredAh,
      packNominalVolts: packVolts,
      cellNominalVolts: cell.volts,
      label: labelOf(ctx),
      warnFraction,
    });
    if (c) {
      const measured =
        c.measuredBasis === 'measured-wh'
          ? `${fmt(c.measuredWh)} Wh delivered at the pack terminals (∫V·I dt)`
          : `${fmt(measuredAh)} Ah delivered × ${fmt(packVolts)} V pack nominal = ${fmt(c.measuredWh)} Wh`;
      out.label = {
        claimedAh: ctx.device.claimCapacityAh,
        measuredAh,
        claimedWh: c.labelWh,
        measuredWh: c.measuredWh,
        labelBasis: c.labelBasis,
        measuredBasis: c.measuredBasis,
        basis: `${measured} against ${labelWords(c.labelBasis, c.labelWh, ctx)}.`,
        percent: c.ratio * 100,
        warning: c.warning,
      };
    }
    if (ctx.pack) {
      // Cells in series add voltage, not charge: the pack delivers the Ah of one string.
      const ratedAh = ctx.pack.cellRatedAh * ctx.pack.parallel;
      const r = capacityVersusLabel(measuredAh, ratedAh, warnFraction);
      const basis = ctx.pack.parallel > 1 ? `${ctx.pack.parallel} cells of ${fmt(ctx.pack.cellRatedAh)} Ah in parallel (pack record)` : `cell rated ${fmt(ctx.pack.cellRatedAh)} Ah (pack record)`;
      out.rated = { ratedAh, measuredAh, percent: r.percent, warning: r.warning, basis };
    }
  }
  if (kind === 'power-bank' && analysis.wattHours !== null) {
    const label = labelEnergyWh(labelOf(ctx), cell.volts);
    if (label) {
      const percent = (analysis.wattHours / label.wh) * 100;
      out.labelEnergy = {
        claimedWh: label.wh,
        measuredWh: analysis.wattHours,
        percent,
        warning: percent < POWER_BANK_MIN_OUTPUT_SHARE * 100,
        basis: `${fmt(analysis.wattHours)} Wh at the output${analysis.averageVolts !== null ? ` (${fmt(analysis.averageVolts)} V average)` : ''} against ${labelWords(label.basis, label.wh, ctx)}.`,
      };
    }
  }
  return out;
}
