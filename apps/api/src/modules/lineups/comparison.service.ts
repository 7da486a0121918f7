// The normalised comparison of a lineup. Per device it takes the latest teardown the caller may
// see, reads its figures (figures service), its should-cost (cost service) and its latest
// discharge run (bench runs), converts money into the lineup currency with the current rates, and
// lets packages/calc do the rest: comparisonMetrics, weightedScores and paretoFrontierXY. What
// the rows need is read for all devices at once (LineupReads), so the query count does not grow
// with the lineup.
import type { EntityManager } from '@mikro-orm/sqlite';
import {
  chooseMode,
  comparisonMetrics,
  convertCurrency,
  crossRate,
  formulaOf,
  mainLoads,
  METRICS,
  paretoFrontierXY,
  teardownFigures,
  weightedScores,
  type DeviceFigures,
  type Figure,
  type LoadKind,
  type MetricKey,
  type TeardownFigureInput,
} from '@splitcase/calc';
import {
  ESTIMATES_NOTE,
  HOT_SURFACE_CAUTION,
  LINEUP_METRIC_KEYS,
  SEVERITY,
  type ComparisonDto,
  type ComparisonMetricDto,
  type ComparisonRowDto,
  LINEUP_MODE_RULE,
  type LineupMetricKey,
  type LineupModeChoice,
  type Severity,
} from '@splitcase/contracts';

/** The mode rule in words, for a missing runtime ("the power-bank output"). */
const modeRuleWords = (m: LineupModeChoice) => (m.rule === 'named' ? `called "${m.name}"` : `"${LINEUP_MODE_RULE.labels[m.rule]}"`);
import { AppError } from '../../http/errors';
import type { AuthUser } from '../../http/route';
import { costOf, costReads, type CostReads } from '../cost/cost.service';
import { findInChunks, refId } from '../../db/batch';
import { currentRateTable, hasRate } from '../cost/rates.service';
import type { RateTable } from '../cost/rate-table.entity';
import type { Device } from '../devices/device.entity';
import { visibleTeardownsByDevice } from '../devices/device.service';
import { figureInputs } from '../figures/figures.service';
import { FindingSchema } from '../findings/finding.entity';
import { DRAFT_READERS } from '../teardowns/access';
import type { Teardown } from '../teardowns/teardown.entity';
import { lineupDevices, visibleDeviceIds } from './lineups.service';
import type { Lineup } from './lineup.entity';

export const DEFAULT_AXES: { x: LineupMetricKey; y: LineupMetricKey } = { x: 'retailPrice', y: 'packWh' };

/** A number for a sentence: four significant figures, no float noise. */
const n4 = (x: number) => String(Number(x.toPrecision(4)));
const money = (x: number, cur: string) => `${x.toFixed(2)} ${cur}`;

const FINDING_KEYS: Record<Severity, MetricKey> = { critical: 'findingsCritical', major: 'findingsMajor', minor: 'findingsMinor', note: 'findingsNote' };

const SHORT: Record<LineupMetricKey, string> = {
  retailPrice: 'Price',
  packWh: 'Pack energy',
  capacityVsLabel: 'Capacity vs label',
  runtimeH: 'Runtime',
  whPerCurrency: 'Energy for money',
  whPerKg: 'Specific energy',
  heaterWPerCm2: 'Heater density',
  shouldCost: 'Should-cost',
  impliedMargin: 'Margin',
  findingsCritical: 'Critical',
  findingsMajor: 'Major',
  findingsMinor: 'Minor',
  findingsNote: 'Notes',
};

/** What each metric is, its formula and source, in the lineup's currency. */
export function metricCatalogue(currency: string): ComparisonMetricDto[] {
  const entry = (key: LineupMetricKey, extra: { format: ComparisonMetricDto['format']; unit?: string; description: string; formula: string; source: string }): ComparisonMetricDto => ({
    key,
    label: METRICS[key].label,
    short: SHORT[key],
    unit: extra.unit ?? METRICS[key].unit,
    better: METRICS[key].better,
    format: extra.format,
    description: extra.description,
    formula: extra.formula,
    source: extra.source,
    applies: true,
  });
  const f = formulaOf;
  const cur = f('cost.currency');
  const findings = (key: LineupMetricKey, severity: Severity) =>
    entry(key, {
      format: 'count',
      unit: 'findings',
      description: `${SEVERITY.labels[severity]} findings recorded on the teardown the row uses.`,
      formula: `count of findings with severity ${severity}`,
      source: 'Findings of the teardown [C]',
    });
  return [
    entry('retailPrice', {
      format: 'money',
      unit: currency,
      description: `Retail price as seen in the shop, converted to ${currency} with the current rate table.`,
      formula: cur.formula,
      source: cur.source,
    }),
    entry('packWh', { format: 'quantity', description: 'Energy of the pack from the rated capacity of its cells at nominal voltage.', ...f('pack.energy') }),
    entry('capacityVsLabel', {
      format: 'percent',
      unit: '%',
      description: 'Capacity delivered in the latest discharge bench run (pack terminals) against the capacity on the label.',
      formula: 'Q_measured / Q_label',
      source: f('capacity.measuredVsLabel').source,
    }),
    entry('runtimeH', {
      format: 'quantity',
      description:
        "Runtime in the operating mode the lineup compares (by default the one with the most power at the device's main load: the heater of a pocket heater, the USB output of a power bank, the LED of a headlamp, the motor of a fan); without recorded modes, the main load alone at its recorded duty. On usable energy: the discharge run's Wh when there is one.",
      ...f('runtime.hours'),
    }),
    entry('whPerCurrency', {
      format: 'quantity',
      unit: `Wh/${currency}`,
      description: `Pack energy for each unit of retail price in ${currency}.`,
      ...f('compare.whPerCurrency'),
    }),
    entry('whPerKg', { format: 'quantity', description: 'Pack energy per kilogram of pack mass.', ...f('pack.specificEnergy') }),
    entry('heaterWPerCm2', {
      format: 'quantity',
      description: 'Heater power at full duty over the heated area (the hottest heater when there are several). Heaters only.',
      ...f('heater.powerDensity'),
    }),
    entry('shouldCost', {
      format: 'money',
      unit: currency,
      description: `Landed should-cost per unit at the middle volume of the cost model, in ${currency}.`,
      ...f('cost.rollUp'),
    }),
    entry('impliedMargin', {
      format: 'percent',
      unit: '%',
      description: "What is left to the maker after the channel's shares and the landed should-cost, as a share of the net to the maker.",
      formula: `${f('cost.impliedMargin').formula}; share = margin / net`,
      source: f('cost.impliedMargin').source,
    }),
    findings('findingsCritical', 'critical'),
    findings('findingsMajor', 'major'),
    findings('findingsMinor', 'minor'),
    findings('findingsNote', 'note'),
  ];
}

interface DeviceRow {
  device: Device;
  teardown: Teardown | null;
  figures: DeviceFigures;
  /** Reasons for the metrics that will be missing, by metric key. */
  missing: Partial<Record<MetricKey, string>>;
  sources: Partial<Record<MetricKey, string>>;
  retail: ComparisonRowDto['retail'];
  notes: string[];
  noTeardown: boolean;
  /** A heater (by category or by a heater load): the heater metric applies. */
  heater: boolean;
  /** The mode the runtime comes from (null: no modes recorded). */
  mode: ComparisonRowDto['mode'];
}

const figureOf = (figures: Figure[], key: string, modeId?: string) => figures.find((f) => f.key === key && f.modeId === modeId);
/** An input of a figure by its key (never by its label). */
const inputOf = (f: Figure | undefined, key: string) => f?.inputs.find((i) => i.key === key)?.value;
const numberInput = (f: Figure | undefined, key: string) => {
  const v = inputOf(f, key);
  return typeof v === 'number' ? v : undefined;
};
const textInput = (f: Figure | undefined, key: string) => {
  const v = inputOf(f, key);
  return typeof v === 'string' ? v : undefined;
};

/** What the rows are made from, read for the whole lineup at once (a fixed number of queries whatever the count). */
interface LineupReads {
  /** The figures service's input per teardown. */
  inputs: Map<number, TeardownFigureInput>;
  /** Parts, prices, cost models, rates and settings of the teardowns. */
  cost: CostReads;
  /** Finding counts by severity per teardown. */
  findings: Map<number, Record<Severity, number>>;
}

/** Finding counts by severity of many teardowns, in one query per chunk of ids. */
async function findingCounts(em: EntityManager, teardownIds: readonly number[]): Promise<Map<number, Record<Severity, number>>> {
  const rows = await findInChunks(teardownIds, (chunk) => em.find(FindingSchema, { teardown: { $in: chunk } }, { fields: ['id', 'teardown', 'severity'] as never }));
  const out = new Map<number, Record<Severity, number>>();
  for (const f of rows) {
    const id = refId(f.teardown);
    const counts = out.get(id) ?? { note: 0, minor: 0, major: 0, critical: 0 };
    counts[f.severity] += 1;
    out.set(id, counts);
  }
  return out;
}

/** Everything known about one device for the lineup, in the lineup currency. */
function deviceRow(reads: LineupReads, device: Device, teardown: Teardown | null, currency: string, table: RateTable | null, viewer: boolean, modeChoice: LineupModeChoice): DeviceRow {
  let mode: DeviceRow['mode'] = null;
  const missing: DeviceRow['missing'] = {};
  const sources: DeviceRow['sources'] = {};
  const notes: string[] = [];
  const fig: DeviceFigures = { findingsBySeverity: { note: 0, minor: 0, major: 0, critical: 0 } };

  // Retail price, converted with the current rate table.
  let retail: DeviceRow['retail'] = null;
  const price = device.retailPrice === null || device.retailPrice === undefined ? null : Number(device.retailPrice);
  const seen = device.priceSeenOn ? `, seen ${device.priceSeenOn}` : '';
  if (price === null || !device.retailCurrency) {
    missing.retailPrice = 'No retail price recorded on the device.';
  } else if (!(price > 0)) {
    missing.retailPrice = 'The recorded retail price is zero.';
  } else if (device.retailCurrency === currency) {
    fig.retailPrice = price;
    retail = { amount: price, currency, seenOn: device.priceSeenOn ?? null, rate: null };
    sources.retailPrice = `${money(price, currency)}${seen}`;
  } else if (table && hasRate(table, device.retailCurrency) && hasRate(table, currency)) {
    const rates = { base: table.base, rates: table.rates };
    const rate = crossRate(rates, device.retailCurrency, currency);
    fig.retailPrice = convertCurrency(price, device.retailCurrency, currency, rates);
    retail = { amount: price, currency: device.retailCurrency, seenOn: device.priceSeenOn ?? null, rate };
    sources.retailPrice = `${money(price, device.retailCurrency)}${seen}, × ${n4(rate)} ${currency}/${device.retailCurrency} (rates of ${table.date})`;
  } else {
    retail = { amount: price, currency: device.retailCurrency, seenOn: device.priceSeenOn ?? null, rate: null };
    missing.retailPrice = table
      ? `The price is in ${device.retailCurrency}, which the current rate table (${table.date}) cannot convert to ${currency}.`
      : `The price is in ${device.retailCurrency} and there is no rate table to convert it.`;
  }

  const noTeardown = teardown === null;
  if (!teardown) {
    const why = viewer ? 'No published teardown of this device yet.' : 'No teardown of this device yet.';
    for (const key of LINEUP_METRIC_KEYS) if (key !== 'retailPrice' && key !== 'whPerCurrency') missing[key] = why;
    if (fig.retailPrice !== undefined) missing.whPerCurrency = why;
    return { device, teardown, figures: fig, missing, sources, retail, notes, noTeardown, heater: device.category === 'pocket-heater', mode: null };
  }
  const from = `teardown #${teardown.id} (${teardown.date})`;

  // Figures of the teardown (pack, loads, heaters, label capacity), through the figures service's input and calc.
  const input = reads.inputs.get(teardown.id) ?? null;
  let figures: Figure[] = [];
  try {
    if (input) figures = teardownFigures(input).figures;
  } catch (err) {
    if (!(err instanceof RangeError)) throw err;
    notes.push(`The figures of ${from} cannot be worked out: ${err.message}`);
    for (const key of ['packWh', 'runtimeH', 'whPerKg', 'heaterWPerCm2', 'capacityVsLabel'] as const) missing[key] = `The figures of this teardown cannot be worked out: ${err.message}`;
  }

  if (input) {
    const energy = figureOf(figures, 'pack.energy');
    if (energy && typeof energy.value === 'number') {
      fig.packWh = energy.value;
      const p = input.pack!;
      sources.packWh = `${n4(p.cellNominalVolts)} V × ${n4(p.cellRatedAh)} Ah × ${p.series}S${p.parallel}P, power system of ${from}`;
      if (p.packMassKg !== undefined) {
        fig.packMassKg = p.packMassKg;
        sources.whPerKg = `${n4(energy.value)} Wh ÷ ${n4(p.packMassKg * 1000)} g pack mass, ${from}`;
      } else missing.whPerKg = 'No pack mass recorded in the power system.';
    } else {
      missing.packWh = 'No cells recorded in the power system of the teardown.';
      missing.whPerKg = missing.packWh;
    }

    // Runtime in the lineup's chosen mode when the teardown records modes; else at the main load
    // only, at its own duty (the same figures, with the other loads left out).
    const main = mainLoads(
      device.category,
      input.loads.map((l) => {
        const w = figureOf(figures, `load.${l.id}.power`)?.value;
        return { id: l.id, kind: l.kind as LoadKind, fullDutyWatts: typeof w === 'number' ? w : null };
      }),
    );
    if (!input.pack) missing.runtimeH = 'No cells recorded in the power system of the teardown.';
    else if (input.modes && input.modes.length > 0) {
      const fullWatts = (loadId: string) => {
        const w = figureOf(figures, `load.${loadId}.power`)?.value;
        return typeof w === 'number' ? w : 0;
      };
      const kindOf = new Map(input.loads.map((l) => [l.id, l.kind]));
      const chosen = chooseMode(
        input.modes.map((m) => ({
          id: m.id,
          name: m.name,
          mainLoadWatts: m.loads.filter((l) => main.ids.includes(l.loadId)).reduce((sum, l) => sum + l.duty * fullWatts(l.loadId), 0),
          usbOutput: m.loads.some((l) => l.duty > 0 && kindOf.get(l.loadId) === 'usb-output'),
        })),
        modeChoice,
      );
      if (!chosen) missing.runtimeH = `No recorded mode fits ${modeRuleWords(modeChoice)}.`;
      else {
        mode = { id: Number(chosen.id), name: chosen.name, reason: chosen.reason };
        const runtime = figureOf(figures, 'mode.runtime.hours', chosen.id);
        if (runtime && typeof runtime.value === 'number') {
          fig.runtimeH = runtime.value;
          const watts = numberInput(runtime, 'packWatts');
          sources.runtimeH = `Mode "${chosen.name}" (${chosen.reason})${watts !== undefined ? `, ${n4(watts)} W from the pack` : ''}; usable energy: ${textInput(runtime, 'usableBasis') ?? 'rated'}; ${from}`;
        } else missing.runtimeH = `Mode "${chosen.name}" draws no power from the pack.`;
      }
    } else if (main.ids.length === 0) missing.runtimeH = input.loads.length ? 'No load with a resistance, current or power recorded.' : 'No load recorded in the power system.';
    else {
      const mainLoadsOnly = input.loads.filter((l) => main.ids.includes(l.id));
      const runtime = figureOf(teardownFigures({ ...input, loads: mainLoadsOnly }).figures, 'runtime.hours');
      if (runtime && typeof runtime.value === 'number') {
        fig.runtimeH = runtime.value;
        const watts = numberInput(runtime, 'packWatts');
        sources.runtimeH = `${mainLoadsOnly.map((l) => `${l.label} at duty ${n4(l.duty * 100)} %`).join(' + ')}${watts !== undefined ? `, ${n4(watts)} W from the pack` : ''} (no modes recorded); usable energy: ${textInput(runtime, 'usableBasis') ?? 'rated'}; ${from}`;
      } else missing.runtimeH = 'The main load draws no power at its recorded duty.';
    }

    if (device.category === 'pocket-heater' || input.loads.some((l) => l.kind === 'heater')) {
      const density = figureOf(figures, 'heater.powerDensity');
      const watts = numberInput(density, 'heaterWatts');
      const area = numberInput(density, 'heatedAreaM2');
      if (density && watts !== undefined && area !== undefined) {
        fig.heaterWatts = watts;
        fig.heatedAreaM2 = area;
        sources.heaterWPerCm2 = `${n4(watts)} W at full duty ÷ ${n4(area * 1e4)} cm², ${from}`;
      } else missing.heaterWPerCm2 = 'No heater with a heated area and a power recorded.';
    } else missing.heaterWPerCm2 = 'Not a heater: the metric applies to heater loads only.';

    // Measured capacity: the latest discharge bench run against the label, in Wh (as in the figures panel).
    const run = input.measuredDischarge;
    if (!run && input.measuredCapacityAh === undefined) missing.capacityVsLabel = 'No discharge bench run with a delivered capacity on the teardown.';
    else {
      const cap = figureOf(figures, 'capacity.measuredVsLabel');
      const measuredWh = numberInput(cap, 'measuredWh');
      const labelWh = numberInput(cap, 'labelWh');
      if (measuredWh === undefined || labelWh === undefined || !(labelWh > 0)) missing.capacityVsLabel = 'No label capacity on the device and no cells recorded to compare with.';
      else {
        fig.measuredWh = measuredWh;
        fig.labelWh = labelWh;
        sources.capacityVsLabel = `${n4(measuredWh)} Wh (${textInput(cap, 'measuredBasis') ?? 'measured'}) ÷ ${n4(labelWh)} Wh (${textInput(cap, 'labelBasis') ?? 'label'}), ${from}`;
      }
    }
  }

  // Should-cost and implied margin from the cost service, at the cost model's middle volume (totals
  // only: a comparison never carries line prices, whoever reads it).
  try {
    const cost = costOf(reads.cost, teardown, { currency }, 'totals');
    if (cost.lines.length === 0) {
      missing.shouldCost = 'No parts list on the teardown yet.';
      missing.impliedMargin = missing.shouldCost;
    } else {
      const unpriced = cost.unpricedPartIds.length;
      if (unpriced === cost.lines.length) {
        missing.shouldCost = 'No part of the teardown has a price yet.';
        missing.impliedMargin = missing.shouldCost;
      } else {
        fig.shouldCost = cost.landed;
        const partial = unpriced ? `; ${unpriced} of ${cost.lines.length} parts unpriced (the figure is low)` : '';
        sources.shouldCost = `Landed should-cost at ${cost.volume.toLocaleString('en-GB')} units (${cost.model.source} cost model), rates of ${cost.rateDate ?? '—'}${partial}, ${from}`;
        if (unpriced) notes.push(`${unpriced} of ${cost.lines.length} parts of ${from} have no price: its should-cost is low and its margin is left out.`);
        const margin = cost.impliedMargin;
        const fraction = margin?.fraction;
        if (margin && !margin.complete) missing.impliedMargin = `Implied margin incomplete: ${margin.reason ?? 'some lines are unpriced.'}`;
        else if (margin && typeof fraction === 'number' && margin.amount !== null && cost.retail) {
          fig.impliedMarginFraction = fraction;
          const tax = cost.retail.salesTax;
          const taxNote = tax.rate > 0 ? ` (retail less ${n4(tax.rate * 100)} % sales tax, ${tax.source === 'device' ? 'set on the device' : `workspace default for ${tax.currency}`})` : '';
          sources.impliedMargin = `Net to maker ${money(cost.retail.netToMaker, currency)}${taxNote} − landed ${money(cost.landed, currency)} = ${money(margin.amount, currency)}, ${from}`;
        } else missing.impliedMargin = cost.warnings.find((w) => /retail|margin/i.test(w)) ?? 'No retail price to set the should-cost against.';
      }
    }
  } catch (err) {
    if (!(err instanceof AppError) && !(err instanceof RangeError)) throw err;
    missing.shouldCost = `The should-cost cannot be worked out: ${err.message}`;
    missing.impliedMargin = missing.shouldCost;
  }

  fig.findingsBySeverity = { ...fig.findingsBySeverity, ...reads.findings.get(teardown.id) };
  for (const severity of SEVERITY.values) sources[FINDING_KEYS[severity]] = `Findings of ${from}`;
  const heater = device.category === 'pocket-heater' || (input?.loads.some((l) => l.kind === 'heater') ?? false);
  return { device, teardown, figures: fig, missing, sources, retail, notes, noTeardown, heater, mode };
}

/** Sources of the derived metrics, once both inputs are known. */
function derivedSources(r: DeviceRow, metrics: Record<MetricKey, number | null>, currency: string): void {
  const { figures: f, missing, sources } = r;
  if (metrics.whPerCurrency !== null) sources.whPerCurrency = `${n4(f.packWh!)} Wh ÷ ${money(f.retailPrice!, currency)}`;
  else missing.whPerCurrency ??= missing.packWh ?? missing.retailPrice ?? 'Pack energy or retail price missing.';
}

export interface ComparisonOptions {
  weights: Record<string, number>;
  weightsFrom: 'saved' | 'preview';
  mode: LineupModeChoice;
  x?: LineupMetricKey | undefined;
  y?: LineupMetricKey | undefined;
}

/** The comparison of a lineup for this user: rows, ranking and the Pareto frontier of two metrics. */
export async function lineupComparison(em: EntityManager, user: AuthUser, lineup: Lineup, opts: ComparisonOptions): Promise<ComparisonDto> {
  const currency = lineup.currency;
  const table = await currentRateTable(em);
  const all = (await lineupDevices(em, [lineup.id])).get(lineup.id) ?? [];
  const visible = await visibleDeviceIds(
    em,
    user,
    all.map((d) => d.id),
  );
  const devices = all.filter((d) => visible.has(d.id));
  const teardowns = await visibleTeardownsByDevice(
    em,
    user,
    devices.map((d) => d.id),
  );
  const viewer = !DRAFT_READERS.includes(user.role);

  const latestOf = new Map(devices.map((d) => [d.id, teardowns.get(d.id)?.[0] ?? null]));
  const latest = [...latestOf.values()].filter((t): t is Teardown => t !== null);
  await em.populate(latest, ['device']);
  const ids = latest.map((t) => t.id);
  const reads: LineupReads = { inputs: await figureInputs(em, latest), cost: await costReads(em, latest), findings: await findingCounts(em, ids) };
  const rows = devices.map((d) => deviceRow(reads, d, latestOf.get(d.id) ?? null, currency, table, viewer, opts.mode));

  const computed = rows.map((r) => {
    const metrics = comparisonMetrics(r.figures);
    if (r.noTeardown) for (const key of Object.values(FINDING_KEYS)) metrics[key] = null;
    derivedSources(r, metrics, currency);
    for (const key of LINEUP_METRIC_KEYS) {
      if (metrics[key] === null) {
        r.missing[key] ??= 'Not recorded.';
        delete r.sources[key];
      } else delete r.missing[key];
    }
    return { r, metrics };
  });

  const scored = weightedScores(
    computed.map((c) => ({ id: String(c.r.device.id), metrics: c.metrics })),
    opts.weights,
  );
  const byId = new Map(computed.map((c) => [String(c.r.device.id), c]));
  const weighted = LINEUP_METRIC_KEYS.filter((k) => (opts.weights[k] ?? 0) > 0);
  const totalWeight = weighted.reduce((s, k) => s + opts.weights[k]!, 0);
  const coverage = (metrics: Record<MetricKey, number | null>) => {
    const known = weighted.filter((k) => metrics[k] !== null);
    return { known: known.length, weighted: weighted.length, weightShare: totalWeight > 0 ? known.reduce((s, k) => s + opts.weights[k]!, 0) / totalWeight : 0 };
  };

  const x = opts.x ?? DEFAULT_AXES.x;
  const y = opts.y && opts.y !== x ? opts.y : x === DEFAULT_AXES.y ? DEFAULT_AXES.x : DEFAULT_AXES.y;
  const points: { id: string; x: number; y: number }[] = [];
  const leftOut: ComparisonDto['pareto']['leftOut'] = [];
  const labelOf = (key: MetricKey) => METRICS[key].label.toLowerCase();
  for (const c of computed) {
    const vx = c.metrics[x];
    const vy = c.metrics[y];
    if (vx !== null && vy !== null) points.push({ id: String(c.r.device.id), x: vx, y: vy });
    else {
      const key = vx === null ? x : y;
      leftOut.push({ deviceId: c.r.device.id, reason: `No ${labelOf(key)}: ${c.r.missing[key] ?? 'not recorded.'}` });
    }
  }
  const frontier = paretoFrontierXY(points, { xBetter: METRICS[x].better, yBetter: METRICS[y].better });
  const onFrontier = new Set(frontier);

  const anyHeater = rows.some((r) => r.heater);
  const notes = [ESTIMATES_NOTE, ...(anyHeater ? [HOT_SURFACE_CAUTION] : []), ...computed.flatMap((c) => c.r.notes)];

  return {
    lineupId: lineup.id,
    currency,
    rateTable: table ? { id: table.id, date: table.date, source: table.source, base: table.base } : null,
    rateDate: table?.date ?? null,
    weights: Object.fromEntries(LINEUP_METRIC_KEYS.map((k) => [k, opts.weights[k] ?? 0])),
    weightsFrom: opts.weightsFrom,
    mode: opts.mode,
    metrics: metricCatalogue(currency).map((m) => (m.key === 'heaterWPerCm2' ? { ...m, applies: rows.some((r) => r.heater) } : m)),
    rows: scored.map((s) => {
      const { r, metrics } = byId.get(s.id)!;
      const d = r.device;
      return {
        deviceId: d.id,
        device: { maker: d.maker, model: d.model, category: d.category, label: `${d.maker} ${d.model}` },
        teardown: r.teardown ? { id: r.teardown.id, date: r.teardown.date, unitLabel: r.teardown.unitLabel ?? null, status: r.teardown.status } : null,
        metrics,
        missing: r.missing as Record<string, string>,
        sources: r.sources as Record<string, string>,
        score: s.score,
        rank: s.rank,
        coverage: coverage(metrics),
        normalised: s.normalised as Record<string, number>,
        retail: r.retail,
        mode: r.mode,
        complete: s.complete,
        incompleteMetrics: s.missing as LineupMetricKey[],
        notes: r.notes,
      };
    }),
    pareto: {
      x,
      y,
      deviceIds: frontier.map(Number),
      points: points.map((p) => ({ deviceId: Number(p.id), x: p.x, y: p.y, onFrontier: onFrontier.has(p.id) })),
      leftOut,
    },
    hiddenDevices: all.length - devices.length,
    notes,
    computedAt: new Date().toISOString(),
  };
}
