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
  if (ctx.device.claimCapacityWh) return { wh: ctx.device.claimCapacityWh, source: `label energy: ${fmt(ctx.device.claimCapacityWh)} Wh` };
  if (ctx.device.claimCapacityAh) {
    const wh = ctx.device.claimCapacityAh * ASSUMED_LABEL_VOLTS;
    return { wh, source: `label capacity ${fmt(ctx.device.claimCapacityAh)} Ah × ${ASSUMED_LABEL_VOLTS} V (nominal voltage assumed) = ${fmt(wh)} Wh` };
  }
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
    const r = analyseDischarge(series, { cutoffVolts });
    if (cutoffVolts === undefined) notes.push('No cut-off voltage given: the totals run until the load stops (or to the end of the log).');
    else if (r.cutoff) notes.push(`Totals up to the first sample at or below the ${fmt(cutoffVolts)} V cut-off, after ${hms(r.cutoff.t)}.`);
    else {
      notes.push(`The log never reaches the ${fmt(cutoffVolts)} V cut-off: the totals cover the whole log.`);
      warnings.push(`The voltage never fell to the ${fmt(cutoffVolts)} V cut-off (lowest ${fmt(r.minVolts)} V): the cell may not be fully discharged, so the capacity is a lower bound.`);
    }
    if (!series.i) notes.push('Current worked out as power ÷ voltage per sample.');
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
      },
    };
  }

  if (kind === 'charge') {
    const terminationFraction = options.terminationFraction ?? DEFAULT_TERMINATION_FRACTION;
    const r = analyseCharge(series, { cvVolts: options.cvVolts ?? undefined, terminationFraction });
    if (options.cvVolts === undefined || options.cvVolts === null) notes.push(`Charge voltage estimated from the top of the log: ${fmt(r.plateauVolts, 4)} V.`);
    notes.push(`Termination at ${fmt(terminationFraction * 100)} % of the constant current (${fmt(r.terminationCurrentA)} A).`);
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
      warnings.push(
        `The surface reached ${fmt(r.maxC)} °C, ${fmt(-marginC, 2)} °C above the ${burn.thresholdC} °C burn threshold for ${contactSeconds} s contact with ${material}.`,
      );
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

/** Measured against the label (and the rated cells), with the workspace's warning threshold. */
export function compareRun(kind: RunKind, analysis: RunAnalysis, ctx: AnalysisContext, warnFraction: number): RunComparison {
  const out: RunComparison = { warnBelowPercent: warnFraction * 100, label: null, rated: null, labelEnergy: null };
  if (kind === 'discharge' && analysis.ampHours !== null) {
    const measuredAh = analysis.ampHours;
    if (ctx.device.claimCapacityAh) {
      const c = capacityVersusLabel(measuredAh, ctx.device.claimCapacityAh, warnFraction);
      out.label = { claimedAh: ctx.device.claimCapacityAh, measuredAh, percent: c.percent, warning: c.warning };
    }
    if (ctx.pack) {
      const ratedAh = ctx.pack.cellRatedAh * ctx.pack.parallel;
      const c = capacityVersusLabel(measuredAh, ratedAh, warnFraction);
      const basis =
        ctx.pack.parallel > 1 ? `${ctx.pack.parallel} cells of ${fmt(ctx.pack.cellRatedAh)} Ah in parallel (pack record)` : `cell rated ${fmt(ctx.pack.cellRatedAh)} Ah (pack record)`;
      out.rated = { ratedAh, measuredAh, percent: c.percent, warning: c.warning, basis };
    }
  }
  if (kind === 'power-bank' && analysis.wattHours !== null) {
    const claimedWh = ctx.device.claimCapacityWh ?? (ctx.device.claimCapacityAh ? ctx.device.claimCapacityAh * ASSUMED_LABEL_VOLTS : null);
    if (claimedWh) {
      const percent = (analysis.wattHours / claimedWh) * 100;
      out.labelEnergy = { claimedWh, measuredWh: analysis.wattHours, percent, warning: percent < POWER_BANK_MIN_OUTPUT_SHARE * 100 };
    }
  }
  return out;
}
