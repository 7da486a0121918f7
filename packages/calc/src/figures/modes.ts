// Operating modes: the loads active in each mode at their duty, and per mode the power at the loads,
// the power and current from the pack, C-rate, runtime on usable energy, the hottest heater's surface
// and touch margin, the loaded cell (internal resistance) and standby. Without modes every load runs
// at its own duty at once, under the figure keys of that case, and the figures say so.
import { cRate, isLithiumChemistry, LI_ION_SELF_DISCHARGE_PER_MONTH, loadedTerminalVolts, packResistanceOhms, resistiveLoadOnSource, runtimeHours, standbyMonths } from '../battery/index';
import { requireNonNegative } from '../shared/validate';
import { figure, inp, num, requireId, unique } from './build';
import { usableEnergy, type FigureContext } from './context';
import {
  applyMeasured,
  dutyForTargetFigure,
  heaterAt,
  heaterExtraFigures,
  hottest,
  powerDensityFigure,
  surfaceRiseFigure,
  surfaceTemperatureFigure,
  touchMarginFigure,
  type HeaterState,
} from './heaters';
import { loadAssumptions, requireModeDuty, type LoadInfo, type LoadSet } from './loads';
import type { Figure, KeyedInput } from './types';

export const ALL_AT_ONCE_NOTE = 'All loads at once: record modes for runtimes per mode.';

export interface ModeRun {
  /** Undefined for the all-loads-at-once case. */
  id?: string;
  name: string;
  entries: { info: LoadInfo; duty: number }[];
  /** Loads of the mode whose power cannot be worked out. */
  missing: string[];
  quiescentAmps: number;
}

export interface ModeResult {
  run: ModeRun;
  /** Average power at the loads (W). */
  loadWatts: number;
  /** Average power from the pack, through the converters, with the quiescent draw (W). */
  packWatts: number;
  /** Average current from the pack (A); undefined without a pack. */
  packAmps?: number;
  runtimeH?: number;
  /** The heater with the least margin in the mode. */
  heater?: HeaterState;
}

/** What the modes leave for the suggestions and the claims. */
export interface ModesOutcome {
  results: ModeResult[];
  /** Heaters of the all-at-once case, or the hottest heater of each mode. */
  heaters: HeaterState[];
  recorded: boolean;
}

function readModes(ctx: FigureContext, loads: LoadSet): ModeRun[] {
  const modes = ctx.input.modes ?? [];
  const ids = new Set<string>();
  return modes.map((m, i) => {
    requireId(m.id, `Mode ${i + 1}`, ids);
    const name = `Mode "${m.name || m.id}"`;
    if (typeof m.name !== 'string' || m.name.trim() === '') throw new RangeError(`Mode ${i + 1} needs a name.`);
    if (!Array.isArray(m.loads)) throw new RangeError(`${name} loads must be a list.`);
    const seen = new Set<string>();
    const entries: ModeRun['entries'] = [];
    const missing: string[] = [];
    for (const entry of m.loads) {
      if (!loads.ids.has(entry.loadId)) throw new RangeError(`${name} refers to load "${entry.loadId}", which is not in this teardown.`);
      if (seen.has(entry.loadId)) throw new RangeError(`${name} lists load "${entry.loadId}" twice.`);
      seen.add(entry.loadId);
      const duty = requireModeDuty(entry.duty, `${name} duty of load "${entry.loadId}"`);
      const info = loads.byId.get(entry.loadId);
      if (info) entries.push({ info, duty });
      else missing.push(`Load "${entry.loadId}" of ${name.toLowerCase()} left out: its power cannot be worked out.`);
    }
    const quiescentAmps = requireNonNegative(m.quiescentAmps ?? 0, `${name} quiescent current (A)`);
    return { id: m.id, name: m.name, entries, missing, quiescentAmps };
  });
}

function evaluate(ctx: FigureContext, run: ModeRun): ModeResult {
  const active = run.entries.filter((e) => e.duty > 0);
  const loadWatts = active.reduce((s, e) => s + e.duty * e.info.r.totalWatts, 0);
  const packVolts = ctx.pack?.volts;
  const quiescentWatts = packVolts !== undefined ? run.quiescentAmps * packVolts : 0;
  const packWatts = active.reduce((s, e) => s + (e.duty * e.info.r.totalWatts) / e.info.eta, 0) + quiescentWatts;
  const packAmps = ctx.pack ? active.reduce((s, e) => s + e.duty * e.info.packAmps, 0) + run.quiescentAmps : undefined;
  const energy = usableEnergy(ctx);
  const runtimeH = energy && active.length > 0 && packWatts > 0 ? runtimeHours({ energyWh: energy.wh, loadWatts: packWatts }) : undefined;
  const heaters = active.filter((e) => e.info.load.kind === 'heater' && e.info.load.heatedAreaM2 !== undefined).map((e) => heaterAt(ctx, e.info, e.duty));
  return { run, loadWatts, packWatts, packAmps, runtimeH, heater: heaters.length ? hottest(heaters) : undefined };
}

const perLoad = (run: ModeRun, f: (e: ModeRun['entries'][number]) => number, key: string, label: string, unit?: string): KeyedInput[] =>
  run.entries.map((e) => inp(`${e.info.load.id}.${key}`, `${e.info.load.label} ${label}`, f(e), unit));

/** Figures of one recorded mode. */
function modeFigures(ctx: FigureContext, m: ModeResult): Figure[] {
  const { run } = m;
  const modeId = run.id;
  const out: Figure[] = [];
  const notes = unique([...run.entries.flatMap((e) => loadAssumptions(e.info)), ...run.missing]);
  const effNotes = unique(run.entries.flatMap((e) => (e.info.converter?.note ? [e.info.converter.note] : [])));
  const active = run.entries.filter((e) => e.duty > 0);
  if (active.length > 0) {
    out.push(
      figure({
        key: 'mode.power',
        label: 'Power at the loads',
        value: m.loadWatts,
        unit: 'W',
        family: 'mode.power',
        inputs: [...perLoad(run, (e) => e.info.r.totalWatts, 'watts', 'power at full duty', 'W'), ...perLoad(run, (e) => e.duty, 'duty', 'duty')],
        assumptions: ['Ideal PWM: average power = duty × full-duty power.', ...notes],
        modeId,
      }),
      figure({
        key: 'mode.packPower',
        label: 'Power from the pack',
        value: m.packWatts,
        unit: 'W',
        family: 'mode.packPower',
        inputs: [
          ...perLoad(run, (e) => (e.duty * e.info.r.totalWatts) / e.info.eta, 'packWatts', 'from the pack', 'W'),
          ...perLoad(run, (e) => e.info.eta, 'efficiency', 'path efficiency'),
          ...(run.quiescentAmps > 0 ? [inp('quiescentAmps', 'Quiescent current', run.quiescentAmps, 'A')] : []),
        ],
        assumptions: [...effNotes, 'Loads wired straight to the pack have efficiency 1.'],
        modeId,
      }),
    );
  }
  const pack = ctx.pack;
  if (pack && m.packAmps !== undefined && (active.length > 0 || run.quiescentAmps > 0)) {
    out.push(
      figure({
        key: 'mode.current',
        label: 'Current from the pack (average)',
        value: m.packAmps,
        unit: 'A',
        family: 'mode.current',
        inputs: [
          ...perLoad(run, (e) => e.info.packAmps, 'peakAmps', 'current at full duty', 'A'),
          ...perLoad(run, (e) => e.duty, 'duty', 'duty'),
          inp('quiescentAmps', 'Quiescent current', run.quiescentAmps, 'A'),
        ],
        assumptions: [...effNotes, 'Average over the PWM period; pulses draw the full-duty current.'],
        modeId,
      }),
    );
  }
  if (pack && m.packAmps !== undefined && active.length > 0) {
    out.push(
      figure({
        key: 'mode.cRate',
        label: 'Discharge rate',
        value: cRate(m.packAmps, pack.ratedAh),
        unit: 'C',
        family: 'pack.cRate',
        inputs: [inp('packAmps', 'Current from the pack', m.packAmps, 'A'), inp('ratedAh', 'Pack rated capacity', pack.ratedAh, 'Ah')],
        warnings: m.packAmps / pack.ratedAh > 1 ? ["Discharge above 1 C: check the cell maker's rated continuous discharge current."] : [],
        modeId,
      }),
    );
  }
  const energy = usableEnergy(ctx);
  if (m.runtimeH !== undefined && energy) {
    out.push(
      figure({
        key: 'mode.runtime.hours',
        label: 'Runtime',
        value: m.runtimeH,
        unit: 'h',
        family: 'runtime.hours',
        inputs: [inp('usableWh', 'Usable energy', energy.wh, 'Wh'), inp('usableBasis', 'Usable energy from', energy.basis), inp('packWatts', 'Power from the pack', m.packWatts, 'W')],
        assumptions: [`Usable energy: ${energy.basis}.`, ...effNotes],
        modeId,
      }),
    );
  }
  if (pack && active.length === 0) out.push(...standbyFigures(ctx, run));
  if (m.heater) {
    out.push(
      surfaceTemperatureFigure(ctx, m.heater, 'mode.surfaceTemperature', `Surface temperature (${m.heater.measured ? 'measured' : 'estimate'}, ${m.heater.info.load.label})`, modeId),
      touchMarginFigure(ctx, m.heater, 'mode.touchMargin', 'Margin to the burn threshold', modeId),
      ...heaterExtraFigures(ctx, m.heater, 'mode.heater', `${m.heater.info.load.label}: `, modeId),
    );
  }
  out.push(...loadedCellFigures(ctx, run, 'mode', modeId));
  return out;
}

/** Months from full to empty with nothing on: self-discharge plus the quiescent current. */
function standbyFigures(ctx: FigureContext, run: ModeRun): Figure[] {
  const pack = ctx.pack!;
  const lithium = isLithiumChemistry(pack.p.chemistry);
  const sd = lithium ? LI_ION_SELF_DISCHARGE_PER_MONTH : 0;
  if (sd === 0 && run.quiescentAmps === 0) return [];
  return [
    figure({
      key: 'mode.standby.months',
      label: 'Standby from full to empty',
      value: standbyMonths({ capacityAh: pack.ratedAh, selfDischargePerMonth: sd, quiescentAmps: run.quiescentAmps }),
      unit: 'months',
      family: 'mode.standby',
      inputs: [
        inp('ratedAh', 'Pack rated capacity', pack.ratedAh, 'Ah'),
        inp('selfDischarge', 'Self-discharge per month', sd),
        inp('quiescentAmps', 'Quiescent current', run.quiescentAmps, 'A'),
        inp('quiescentAhPerMonth', 'Quiescent draw per month', run.quiescentAmps * 730, 'Ah'),
      ],
      assumptions: [
        lithium
          ? 'Li-ion self-discharge about 2–3 % a month at room temperature; 2.5 % taken [CP; M for the figure].'
          : `Self-discharge of ${pack.p.chemistry} cells not known here: the quiescent current alone.`,
        '730 h in an average month; a protection circuit cutting off at its under-voltage level stops the drain before empty.',
      ],
      modeId: run.id,
    }),
  ];
}

/** Loaded terminal voltage, I²R heat in the cells and the power of direct loads on the loaded cell, from the internal resistance. */
function loadedCellFigures(ctx: FigureContext, run: ModeRun, prefix: 'mode' | 'pack', modeId?: string): Figure[] {
  const pack = ctx.pack;
  const ir = ctx.input.cellInternalResistance;
  const active = run.entries.filter((e) => e.duty > 0);
  if (!pack || !ir || active.length === 0) return [];
  const rPack = packResistanceOhms({ cellOhms: ir.ohms, series: pack.p.series, parallel: pack.p.parallel });
  const currents = active.map((e) => ({ d: e.duty, i: e.info.packAmps }));
  if (run.quiescentAmps > 0) currents.push({ d: 1, i: run.quiescentAmps });
  const peak = currents.reduce((s, c) => s + c.i, 0);
  // Mean of i² over a period with the PWM pulses starting together (the worst case): Σ D·I² + Σ_{j≠k} min(D_j, D_k)·I_j·I_k.
  let meanSquare = 0;
  for (const a of currents) for (const b of currents) meanSquare += Math.min(a.d, b.d) * a.i * b.i;
  const irInputs = [
    inp('cellOhms', 'Cell internal resistance', ir.ohms, 'Ω'),
    inp('packOhms', `Pack resistance (${pack.p.series}S${pack.p.parallel}P)`, rPack, 'Ω'),
    inp('source', 'Internal resistance from', ir.basis),
  ];
  const terminal = loadedTerminalVolts({ openCircuitVolts: pack.volts, currentAmps: peak, resistanceOhms: rPack });
  const out: Figure[] = [
    figure({
      key: `${prefix}.terminalVolts`,
      label: 'Pack voltage under load (during a pulse)',
      value: terminal,
      unit: 'V',
      family: 'pack.terminalVolts',
      inputs: [inp('openCircuitVolts', 'Pack nominal voltage', pack.volts, 'V'), inp('peakAmps', 'Current from the pack at full duty', peak, 'A'), ...irInputs],
      assumptions: ['Open-circuit voltage taken as the pack nominal voltage; it falls as the cells empty.'],
      modeId,
    }),
    figure({
      key: `${prefix}.cellHeat`,
      label: 'Heat in the cells (I²R)',
      value: meanSquare * rPack,
      unit: 'W',
      family: 'pack.cellHeat',
      inputs: [inp('meanSquareAmps', 'Mean of i² over a PWM period', meanSquare, 'A²'), ...irInputs],
      assumptions: ['PWM pulses of different loads taken to start together (the worst case).'],
      modeId,
    }),
  ];
  const direct = active.filter((e) => !e.info.converter && e.info.r.basis === 'resistance');
  if (direct.length > 0) {
    const rParallel = 1 / direct.reduce((s, e) => s + 1 / e.info.r.equivalentOhms, 0);
    const on = resistiveLoadOnSource({ openCircuitVolts: pack.volts, loadOhms: rParallel, sourceOhms: rPack });
    const watts = direct.reduce((s, e) => s + (e.duty * on.terminalVolts ** 2) / e.info.r.equivalentOhms, 0);
    out.push(
      figure({
        key: `${prefix}.loadedPower`,
        label: 'Power of the loads fed straight from the cells, on the loaded cells',
        value: watts,
        unit: 'W',
        family: 'pack.loadedPower',
        inputs: [
          inp('openCircuitVolts', 'Pack nominal voltage', pack.volts, 'V'),
          inp('loadOhms', 'Direct loads in parallel', rParallel, 'Ω'),
          inp('terminalVolts', 'Terminal voltage with them on', on.terminalVolts, 'V'),
          ...irInputs,
        ],
        assumptions: ['I = U_oc / (R_load + R_int); each load at its duty at that terminal voltage (all on together, the worst case).'],
        modeId,
      }),
    );
  }
  return out;
}

/** The all-at-once case: today's figure keys, each saying that modes are not recorded. */
function allAtOnceFigures(ctx: FigureContext, loads: LoadSet): ModesOutcome {
  const { computed, skipped } = loads;
  const run: ModeRun = { name: 'All loads at once', entries: computed.map((info) => ({ info, duty: info.load.duty })), missing: [], quiescentAmps: 0 };
  const result = evaluate(ctx, run);
  const figures = ctx.figures;
  const efficiencyNotes = unique(computed.flatMap((l) => (l.converter?.note ? [l.converter.note] : [])));
  if (computed.length > 0) {
    const allAssumptions = unique(computed.flatMap(loadAssumptions));
    figures.push(
      figure({
        key: 'load.power',
        label: 'Total load power (full duty)',
        value: computed.reduce((s, l) => s + l.r.totalWatts, 0),
        unit: 'W',
        family: 'load.power',
        inputs: computed.map((l) => inp(`${l.load.id}.watts`, l.load.label, l.r.totalWatts, 'W')),
        assumptions: [ALL_AT_ONCE_NOTE, ...allAssumptions, ...skipped],
      }),
      figure({
        key: 'load.averagePower',
        label: 'Average load power (at the recorded duty)',
        value: result.loadWatts,
        unit: 'W',
        family: 'load.averagePower',
        inputs: [...computed.map((l) => inp(`${l.load.id}.watts`, l.load.label, l.r.totalWatts, 'W')), ...computed.map((l) => inp(`${l.load.id}.duty`, `${l.load.label} duty`, l.load.duty))],
        assumptions: [ALL_AT_ONCE_NOTE, 'Ideal PWM: average power = duty × full-duty power.', ...skipped],
      }),
    );
  }
  const pack = ctx.pack;
  if (pack && computed.length > 0) {
    const fullAmps = computed.reduce((s, l) => s + l.packAmps, 0);
    figures.push(
      figure({
        key: 'load.current',
        label: 'Current from the pack (full duty)',
        value: fullAmps,
        unit: 'A',
        family: 'load.current',
        inputs: computed.map((l) => inp(`${l.load.id}.packAmps`, l.load.label, l.packAmps, 'A')),
        assumptions: [ALL_AT_ONCE_NOTE, ...efficiencyNotes, 'Loads wired straight to the pack draw their own current (efficiency 1).', ...skipped],
      }),
    );
    const rate = cRate(fullAmps, pack.ratedAh);
    figures.push(
      figure({
        key: 'pack.cRate',
        label: 'Discharge rate at full load',
        value: rate,
        unit: 'C',
        family: 'pack.cRate',
        inputs: [inp('packAmps', 'Current from the pack', fullAmps, 'A'), inp('ratedAh', 'Pack rated capacity', pack.ratedAh, 'Ah')],
        warnings: rate > 1 ? ["Discharge above 1 C: check the cell maker's rated continuous discharge current."] : [],
      }),
    );
  }
  const energy = usableEnergy(ctx);
  if (result.runtimeH !== undefined && energy) {
    const claims = ctx.claims;
    const warnings =
      claims.runtimeH !== undefined && result.runtimeH < 0.8 * claims.runtimeH
        ? [`The label claims ${num(claims.runtimeH)} h; the estimate at the recorded duty is ${num(result.runtimeH)} h (claims are often made at the lowest setting).`]
        : [];
    figures.push(
      figure({
        key: 'runtime.hours',
        label: 'Runtime at the recorded duty',
        value: result.runtimeH,
        unit: 'h',
        family: 'runtime.hours',
        inputs: [
          inp('usableWh', 'Usable energy', energy.wh, 'Wh'),
          inp('usableBasis', 'Usable energy from', energy.basis),
          inp('packWatts', 'Average power drawn from the pack', result.packWatts, 'W'),
          ...(claims.runtimeH !== undefined ? [inp('claimedH', 'Claimed runtime', claims.runtimeH, 'h')] : []),
        ],
        assumptions: [ALL_AT_ONCE_NOTE, `Usable energy: ${energy.basis}.`, ...efficiencyNotes, 'Loads wired straight to the pack have efficiency 1.', ...skipped],
        warnings,
      }),
    );
  }
  figures.push(...loadedCellFigures(ctx, run, 'pack'));

  // Heaters, each at its own duty; the summary is the one with the least margin.
  const heaters = computed.filter((l) => l.load.kind === 'heater' && l.load.heatedAreaM2 !== undefined).map((info) => heaterAt(ctx, info, info.load.duty));
  if (heaters.length > 0) {
    if (ctx.input.measuredSurface) applyMeasured(hottest(heaters), ctx.input.measuredSurface);
    const worst = hottest(heaters);
    const set = (h: HeaterState, prefix: string, labelPrefix: string) => [
      powerDensityFigure(h, `${prefix}.powerDensity`, `${labelPrefix}power density (full duty)`),
      surfaceRiseFigure(ctx, h, `${prefix}.surfaceRise`, `${labelPrefix}surface temperature rise (steady, estimate)`),
      touchMarginFigure(ctx, h, `${prefix}.touchMargin`, `${labelPrefix}margin to the burn threshold`),
    ];
    figures.push(...set(worst, 'heater', heaters.length > 1 ? `Hottest heater (${worst.info.load.label}): ` : 'Heater '));
    figures.push(...heaterExtraFigures(ctx, worst, 'heater', heaters.length > 1 ? `Hottest heater (${worst.info.load.label}): ` : 'Heater '));
    if (heaters.length > 1) for (const h of heaters) figures.push(...set(h, `heater.${h.info.load.id}`, `${h.info.load.label} `));
  }
  return { results: [result], heaters, recorded: false };
}

/** Per-mode figures when modes are recorded, else the all-at-once figures. */
export function modeAndLoadFigures(ctx: FigureContext, loads: LoadSet): ModesOutcome {
  const runs = readModes(ctx, loads);
  const outcome = runs.length === 0 ? allAtOnceFigures(ctx, loads) : recordedModes(ctx, loads, runs);
  heaterWholeDevice(ctx, loads, outcome.recorded);
  return outcome;
}

function recordedModes(ctx: FigureContext, loads: LoadSet, runs: ModeRun[]): ModesOutcome {
  const results = runs.map((run) => evaluate(ctx, run));
  const withHeater = results.filter((r) => r.heater);
  if (ctx.input.measuredSurface && withHeater.length > 0) {
    // The measurement is taken as the hottest mode's: the one whose heater runs at the highest average power.
    const top = withHeater.reduce((a, b) => (b.heater!.avgWatts > a.heater!.avgWatts ? b : a));
    applyMeasured(top.heater!, { ...ctx.input.measuredSurface, basis: `${ctx.input.measuredSurface.basis}, taken as mode "${top.run.name}"` });
  }
  const claims = ctx.claims;
  const longest = results.reduce<ModeResult | undefined>((a, b) => (b.runtimeH !== undefined && (a?.runtimeH === undefined || b.runtimeH > a.runtimeH) ? b : a), undefined);
  for (const r of results) {
    const figs = modeFigures(ctx, r);
    if (r === longest && claims.runtimeH !== undefined && r.runtimeH! < 0.8 * claims.runtimeH) {
      const f = figs.find((x) => x.key === 'mode.runtime.hours');
      f?.warnings.push(`The label claims ${num(claims.runtimeH)} h; the longest runtime of any recorded mode is ${num(r.runtimeH!)} h.`);
      f?.inputs.push(inp('claimedH', 'Claimed runtime', claims.runtimeH, 'h'));
    }
    ctx.figures.push(...figs);
  }
  return { results, heaters: withHeater.map((r) => r.heater!), recorded: true };
}

/** Whole-device heater figures: power density (with modes; without, it is in the set above) and the duty for the target temperature. */
function heaterWholeDevice(ctx: FigureContext, loads: LoadSet, recorded: boolean): void {
  const heaters = loads.computed.filter((l) => l.load.kind === 'heater' && l.load.heatedAreaM2 !== undefined);
  if (heaters.length === 0) return;
  const many = heaters.length > 1;
  if (recorded) {
    const densest = heaters.reduce((a, b) => (b.r.totalWatts / b.load.heatedAreaM2! > a.r.totalWatts / a.load.heatedAreaM2! ? b : a));
    const area = (l: LoadInfo) => ({ info: l, area: l.load.heatedAreaM2! });
    ctx.figures.push(powerDensityFigure(area(densest), 'heater.powerDensity', many ? `Densest heater (${densest.load.label}): power density (full duty)` : 'Heater power density (full duty)'));
    if (many) for (const h of heaters) ctx.figures.push(powerDensityFigure(area(h), `heater.${h.load.id}.powerDensity`, `${h.load.label} power density (full duty)`));
  }
  for (const h of heaters) {
    const f = dutyForTargetFigure(
      ctx,
      h,
      many ? `heater.${h.load.id}.dutyForTarget` : 'heater.dutyForTarget',
      `${many ? `${h.load.label}: ` : ''}duty for ${num(ctx.targetSurfaceC)} °C at the surface`,
    );
    if (f) ctx.figures.push(f);
  }
}
