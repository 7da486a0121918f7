/**
 * The runtime calculator of the bench tools: pack energy, runtime at a load, C-rate, air-transport
 * class, and with a cell mass the specific energy and a plausibility check of the label.
 */
import { AIR_TRANSPORT_CLASS_TEXT, airTransportClass, cRate, packEnergyWh, runtimeHours } from '../battery/pack';
import { isLithiumChemistry, labelCapacityPlausibility, type CellChemistry } from '../battery/chemistry';
import { requireFraction, requireInteger, requirePositive } from '../shared/validate';
import { plain, withPrefix } from '../shared/text';
import { benchFigure, type BenchFigure } from './figure';
import type { FormulaKey } from '../figures/formulas';
import type { FigureInput } from '../shared/explained';

export type RuntimeLoad = { kind: 'power'; watts: number } | { kind: 'resistance'; ohms: number; supplyVolts: number } | { kind: 'current'; amps: number };

export interface RuntimeInput {
  cellNominalVolts: number;
  cellCapacityAh: number;
  series?: number | undefined;
  parallel?: number | undefined;
  load: RuntimeLoad;
  /** Converter efficiency between pack and load (0..1]; default 1. Not applied to a current drawn from the pack. */
  efficiency?: number | undefined;
  /** Share of the rated capacity that is used (0..1]; default 1. */
  usableFraction?: number | undefined;
  /** PWM duty of the load (0..1]; default 1. */
  duty?: number | undefined;
  /** Mass of one cell (kg), for specific energy and the label check. */
  cellMassKg?: number | undefined;
  chemistry?: CellChemistry | undefined;
}

export interface RuntimeReport {
  figures: BenchFigure[];
  warnings: string[];
}

/** Pack energy, runtime, C-rate, transport class and (with a cell mass) specific energy and label plausibility, explained. */
export function runtimeReport(p: RuntimeInput): RuntimeReport {
  const cellV = requirePositive(p.cellNominalVolts, 'Cell nominal voltage (V)');
  const cellAh = requirePositive(p.cellCapacityAh, 'Cell capacity (Ah)');
  const series = requireInteger(p.series ?? 1, 'Cells in series');
  const parallel = requireInteger(p.parallel ?? 1, 'Cells in parallel');
  const efficiency = requirePositive(p.efficiency ?? 1, 'Efficiency');
  requireFraction(efficiency, 'Efficiency');
  const usable = requirePositive(p.usableFraction ?? 1, 'Usable fraction');
  requireFraction(usable, 'Usable fraction');
  const duty = requirePositive(p.duty ?? 1, 'Duty cycle');
  requireFraction(duty, 'Duty cycle');
  const chemistry: CellChemistry = p.chemistry ?? 'li-ion';
  const packV = cellV * series;
  const packAh = cellAh * parallel;

  const figures: BenchFigure[] = [];
  const energyWh = packEnergyWh({ cellNominalVolts: cellV, cellCapacityAh: cellAh, series, parallel });
  figures.push(
    benchFigure({
      key: 'packEnergy',
      label: 'Pack energy',
      value: energyWh,
      unit: 'Wh',
      formulaKey: 'pack.energy',
      inputs: [
        { label: 'Cell nominal voltage', value: cellV, unit: 'V' },
        { label: 'Cell capacity', value: cellAh, unit: 'Ah' },
        { label: 'Cells in series', value: series },
        { label: 'Cells in parallel', value: parallel },
      ],
      assumptions: ['Rated capacity at the nominal voltage; delivered energy falls with load, cold and age.'],
    }),
  );

  // Peak load power (while the load is on) and the current it draws from the pack.
  const load = p.load;
  let peakWatts: number;
  let packAmpsPeak: number;
  const assumptions: string[] = [];
  const loadWarnings: string[] = [];
  let direct = false;
  /** The peak load power figure (key `loadPower`), carrying the load warnings gathered so far. */
  const loadPowerFigure = (label: string, formulaKey: FormulaKey, inputs: FigureInput[], assumption: string) =>
    benchFigure({ key: 'loadPower', label, value: peakWatts, unit: 'W', formulaKey, inputs, assumptions: [assumption], warnings: loadWarnings.splice(0) });
  if (load.kind === 'power') {
    peakWatts = requirePositive(load.watts, 'Load power (W)');
    packAmpsPeak = peakWatts / (efficiency * packV);
  } else if (load.kind === 'resistance') {
    const ohms = requirePositive(load.ohms, 'Load resistance (Ω)');
    const supply = requirePositive(load.supplyVolts, 'Supply voltage (V)');
    peakWatts = (supply * supply) / ohms;
    direct = p.efficiency === undefined && Math.abs(supply - packV) <= 0.05 * packV;
    // Fed straight from the pack the current is V / R; through a converter it is P / (η · V_pack).
    packAmpsPeak = direct ? supply / ohms : peakWatts / (efficiency * packV);
    if (direct) assumptions.push(`Load fed directly from the pack (supply within 5 % of the pack's ${plain(packV)} V): pack current I = V / R.`);
    if (!direct && Math.abs(supply - packV) > 0.05 * packV && p.efficiency === undefined) {
      loadWarnings.push(
        `The load's supply (${plain(supply)} V) is not the pack voltage (${plain(packV)} V), so a converter sits between them; give its efficiency (0.80–0.90 is typical [CP]) for a realistic runtime.`,
      );
    }
    figures.push(
      loadPowerFigure(
        'Load power',
        'electrical.power',
        [
          { label: 'Supply voltage', value: supply, unit: 'V' },
          { label: 'Load resistance', value: ohms, unit: 'Ω' },
        ],
        'Resistance constant (a heater element warms up and changes a little).',
      ),
    );
  } else if (load.kind === 'current') {
    const amps = requirePositive(load.amps, 'Load current (A)');
    packAmpsPeak = amps;
    peakWatts = amps * packV;
    if (p.efficiency !== undefined && p.efficiency !== 1) {
      loadWarnings.push('Efficiency is not applied to a current drawn from the pack: the converter losses are already in that current.');
    }
    figures.push(
      loadPowerFigure(
        'Power drawn from the pack',
        'pack.loadFromCurrent',
        [
          { label: 'Current from the pack', value: amps, unit: 'A' },
          { label: 'Pack nominal voltage', value: packV, unit: 'V' },
        ],
        'The current is drawn from the pack at its nominal voltage.',
      ),
    );
  } else {
    throw new RangeError('The load needs its power (W), its resistance (Ω) with a supply voltage (V), or its current (A).');
  }

  const averageWatts = peakWatts * duty;
  if (duty < 1) {
    figures.push(
      benchFigure({
        key: 'averagePower',
        label: 'Average load power',
        value: averageWatts,
        unit: 'W',
        formulaKey: 'electrical.pwmAveragePower',
        inputs: [
          { label: 'Peak power', value: peakWatts, unit: 'W' },
          { label: 'Duty cycle', value: duty },
        ],
        assumptions: ['Ideal PWM: full power while on, none while off.'],
      }),
    );
  }

  // Runtime: η applies to loads fed through a converter, not to a current measured at the pack.
  const appliedEfficiency = load.kind === 'current' ? 1 : efficiency;
  const hours = runtimeHours({ energyWh, loadWatts: averageWatts, efficiency: appliedEfficiency, usableFraction: usable });
  if (p.efficiency === undefined && load.kind !== 'current' && !direct) {
    assumptions.push('Efficiency 1 assumed: no converter losses, so the runtime is an upper bound.');
  }
  if (p.usableFraction === undefined) assumptions.push('The whole rated capacity is used (usable fraction 1); protection cut-off and ageing shorten it.');
  figures.push(
    benchFigure({
      key: 'runtime',
      label: 'Runtime',
      value: hours,
      unit: 'h',
      formulaKey: 'runtime.hours',
      inputs: [
        { label: 'Pack energy', value: energyWh, unit: 'Wh' },
        { label: 'Efficiency', value: appliedEfficiency },
        { label: 'Usable fraction', value: usable },
        { label: 'Average load power', value: averageWatts, unit: 'W' },
      ],
      assumptions: [...assumptions, 'Rated capacity taken at any load; at high C-rates cells deliver less.'],
      warnings: loadWarnings,
    }),
  );

  // C-rate of each cell while the load is on.
  const rate = cRate(packAmpsPeak, packAh);
  const rateWarnings: string[] = [];
  if (rate > 1) {
    rateWarnings.push(`${plain(rate, 3)} C is a heavy discharge for small cells: check the maker's rated continuous current; capacity delivered at high rates is lower than rated.`);
  }
  figures.push(
    benchFigure({
      key: 'cRate',
      label: duty < 1 ? 'C-rate while the load is on' : 'C-rate',
      value: rate,
      unit: 'C',
      formulaKey: 'pack.cRate',
      inputs: [
        { label: 'Pack current', value: packAmpsPeak, unit: 'A' },
        { label: 'Pack capacity', value: packAh, unit: 'Ah' },
      ],
      assumptions: [
        load.kind === 'current'
          ? 'Pack current as given.'
          : `Pack current ${withPrefix(packAmpsPeak, 'A')} (${direct ? 'V / R' : 'P / (η · V_pack)'}), shared equally by ${parallel} parallel cell${parallel > 1 ? 's' : ''}.`,
      ],
      warnings: rateWarnings,
    }),
  );

  if (isLithiumChemistry(chemistry)) {
    const cls = airTransportClass(energyWh);
    figures.push(
      benchFigure({
        key: 'transportClass',
        label: 'Air-transport class',
        value: cls,
        unit: '',
        formulaKey: 'pack.transportClass',
        inputs: [{ label: 'Pack energy', value: energyWh, unit: 'Wh' }],
        assumptions: [AIR_TRANSPORT_CLASS_TEXT[cls], 'Lithium cells and batteries must pass UN Manual of Tests and Criteria 38.3 to ship [S]; airline and local rules prevail.'],
        warnings: cls === 'up-to-100-wh' ? [] : [AIR_TRANSPORT_CLASS_TEXT[cls]],
      }),
    );
  }

  if (p.cellMassKg !== undefined) {
    const massKg = requirePositive(p.cellMassKg, 'Cell mass (kg)');
    const check = labelCapacityPlausibility({ claimedAh: cellAh, nominalV: cellV, cellMassKg: massKg, chemistry });
    const massInputs = [
      { label: 'Cell energy', value: check.claimedWh, unit: 'Wh' },
      { label: 'Cell mass', value: massKg, unit: 'kg' },
      { label: 'Chemistry', value: chemistry },
    ];
    figures.push(
      benchFigure({
        key: 'specificEnergy',
        label: 'Cell specific energy',
        value: check.specificEnergyWhPerKg,
        unit: 'Wh/kg',
        formulaKey: 'pack.specificEnergy',
        inputs: massInputs,
        assumptions: ['Label capacity and nominal voltage of one cell over the mass of one cell.'],
      }),
      benchFigure({
        key: 'plausibility',
        label: 'Label capacity against cell mass',
        value: check.plausible ? 'plausible' : 'implausible',
        unit: '',
        formulaKey: 'battery.plausibility',
        inputs: [...massInputs, { label: 'Believable limit', value: check.limitWhPerKg, unit: 'Wh/kg' }],
        assumptions: [check.source],
        warnings: check.plausible
          ? []
          : [
              `${plain(check.specificEnergyWhPerKg, 3)} Wh/kg is above the ${check.limitWhPerKg} Wh/kg a commercial ${chemistry} cell reaches: the label capacity is doubtful. Measure it with a discharge run.`,
            ],
      }),
    );
  }

  return { figures, warnings: figures.flatMap((f) => f.warnings) };
}
