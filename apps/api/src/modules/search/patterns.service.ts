// Pattern counts across devices ("1 of 3 pocket heaters has no temperature sensor"). Each device is
// judged on its latest teardown the caller may read; the figure-based patterns take the figures
// service's input and calc's rules (teardownFigures, labelClaimCheck), so they say exactly what the
// figures panel and its suggestions say. `of` counts the devices of the group that have the data
// to judge; the devices behind each count are listed.
import type { EntityManager } from '@mikro-orm/sqlite';
import { isLithiumChemistry, labelClaimCheck, teardownFigures, type TeardownFigureInput, type TeardownFiguresResult } from '@splitcase/calc';
import { ESTIMATES_NOTE, type Pattern, type PatternDevice, type PatternsResponse } from '@splitcase/contracts';
import type { AuthUser } from '../../http/route';
import { FindingSchema } from '../findings/finding.entity';
import { figureInputs } from '../figures/figures.service';
import { PackSchema, type Pack } from '../power/pack.entity';
import { getSettings } from '../settings/settings.service';
import { visibleTeardowns } from '../teardowns/access';
import { TeardownSchema, type Teardown } from '../teardowns/teardown.entity';
import { findInChunks, groupBy, refId } from '../../db/batch';

/** What is known about one device for the patterns. */
interface Judged {
  device: PatternDevice;
  teardown: Teardown;
  /** null when the records could not be computed (the figures panel shows why). */
  input: TeardownFigureInput | null;
  figures: TeardownFiguresResult | null;
  pack: Pack | null;
  /** Findings of every teardown of the device the caller may read. */
  findings: { kind: string; severity: string }[];
}

interface PatternRule {
  key: string;
  title: string;
  /** Sentence with the numbers, e.g. (1, 3) → "1 of 3 pocket heaters has no temperature sensor". */
  sentence: (count: number, of: number) => string;
  basis: string;
  safety: boolean;
  /** true / false when the device can be judged; undefined when it is not in the group or lacks the data. */
  judge: (j: Judged) => boolean | undefined;
}

const plural = (n: number, one: string, many: string) => (n === 1 ? one : many);
const verb = (count: number, one: string, many: string) => (count === 1 ? one : many);
const hasSuggestion = (j: Judged, key: string) => j.figures!.suggestions.some((s) => s.key === key);
const hasLabel = (i: TeardownFigureInput) => i.claims?.capacityAh !== undefined || i.claims?.capacityWh !== undefined;

/** Measured ÷ label (%) from the latest discharge run, when the device has a run and a label claim. */
function runVsLabel(j: Judged): number | undefined {
  if (!j.input || !j.figures || j.input.measuredCapacityAh === undefined || !hasLabel(j.input)) return undefined;
  const f = j.figures.figures.find((x) => x.key === 'capacity.measuredVsLabel');
  return typeof f?.value === 'number' ? f.value : undefined;
}

function rules(warnFraction: number): PatternRule[] {
  const pct = Math.round(warnFraction * 1000) / 10;
  return [
    {
      key: 'heater.no-sensor',
      title: 'Heaters without temperature sensing',
      sentence: (c, of) => `${c} of ${of} ${plural(of, 'pocket heater', 'pocket heaters')} ${verb(c, 'has', 'have')} no temperature sensor`,
      basis: 'Pocket heaters with a heater load and a parts list; counted when no part is recorded as a sensor (the figures rule "Heater without temperature sensing").',
      safety: true,
      judge: (j) =>
        j.device.category === 'pocket-heater' && j.input && j.figures && j.input.loads.some((l) => l.kind === 'heater') && j.input.partCategories.length > 0
          ? hasSuggestion(j, 'thermal.no-sensor')
          : undefined,
    },
    {
      key: 'power-bank.capacity-short',
      title: 'Power banks short of their label',
      sentence: (c, of) => `${c} of ${of} power ${plural(of, 'bank', 'banks')} ${verb(c, 'delivers', 'deliver')} under ${pct} % of ${verb(c, 'its', 'their')} label capacity`,
      basis: `Power banks with a discharge run and a capacity on the label: the latest discharge run at the pack terminals against the label, below the workspace's capacity warning level (${pct} %).`,
      safety: false,
      judge: (j) => {
        if (j.device.category !== 'power-bank') return undefined;
        const r = runVsLabel(j);
        return r === undefined ? undefined : r < warnFraction * 100;
      },
    },
    {
      key: 'capacity-short',
      title: 'Devices short of their label',
      sentence: (c, of) => `${c} of ${of} ${plural(of, 'device', 'devices')} ${verb(c, 'delivers', 'deliver')} under ${pct} % of ${verb(c, 'its', 'their')} label capacity`,
      basis: `Every device with a discharge run and a capacity on the label: the latest discharge run against the label, below the workspace's capacity warning level (${pct} %).`,
      safety: false,
      judge: (j) => {
        const r = runVsLabel(j);
        return r === undefined ? undefined : r < warnFraction * 100;
      },
    },
    {
      key: 'label.beyond-cell-mass',
      title: 'Label capacity beyond the cell mass',
      sentence: (c, of) => `${c} of ${of} ${plural(of, 'device', 'devices')} ${verb(c, 'claims', 'claim')} more capacity than ${verb(c, 'its', 'their')} cell mass allows`,
      basis:
        'Devices with a weighed pack and a capacity on the label: the label energy per kilogram of pack against the chemistry\'s specific-energy limit (the mass reason of the figures rule "Label capacity not supported").',
      safety: false,
      judge: (j) => {
        if (!j.input || !j.figures || !hasLabel(j.input)) return undefined;
        const check = labelClaimCheck(j.input);
        return check?.basis === 'label' ? !check.plausibility.plausible : undefined;
      },
    },
    {
      key: 'pack.no-protection',
      title: 'Lithium packs without protection',
      sentence: (c, of) => `${c} of ${of} lithium ${plural(of, 'pack', 'packs')} ${verb(c, 'has', 'have')} no protection circuit`,
      basis: 'Devices with a lithium pack recorded; counted when no protection circuit is recorded (the figures rule "Lithium pack without protection").',
      safety: true,
      judge: (j) => (j.input?.pack && j.figures && isLithiumChemistry(j.input.pack.chemistry) ? hasSuggestion(j, 'pack.no-protection') : undefined),
    },
    {
      key: 'pack.soldered-cells',
      title: 'Cells soldered directly',
      sentence: (c, of) => `${c} of ${of} ${plural(of, 'device', 'devices')} ${verb(c, 'has its', 'have their')} cells soldered directly`,
      basis: 'Devices whose pack records how the cells are joined; counted when leads are soldered to the cells (not welded tabs, a holder or a plug).',
      safety: true,
      judge: (j) => (j.pack?.joining ? j.pack.joining === 'soldered' : undefined),
    },
    {
      key: 'findings.safety-major',
      title: 'Major or critical safety findings',
      sentence: (c, of) => `${c} of ${of} ${plural(of, 'device', 'devices')} ${verb(c, 'has', 'have')} a major or critical safety finding`,
      basis: 'Devices with at least one finding; counted when a safety finding is major or critical.',
      safety: true,
      judge: (j) => (j.findings.length ? j.findings.some((f) => f.kind === 'safety' && (f.severity === 'major' || f.severity === 'critical')) : undefined),
    },
    {
      key: 'findings.critical',
      title: 'Critical findings',
      sentence: (c, of) => `${c} of ${of} ${plural(of, 'device', 'devices')} ${verb(c, 'has', 'have')} a critical finding`,
      basis: 'Devices with at least one finding; counted when any finding is critical.',
      safety: false,
      judge: (j) => (j.findings.length ? j.findings.some((f) => f.severity === 'critical') : undefined),
    },
  ];
}

/** Every device the caller may see, judged on its latest readable teardown. */
async function judgeDevices(em: EntityManager, user: AuthUser): Promise<Judged[]> {
  const teardowns = await em.find(TeardownSchema, visibleTeardowns(user), { populate: ['device'], orderBy: { date: 'desc', id: 'desc' } });
  const latest = new Map<number, Teardown>();
  const teardownDevice = new Map<number, number>();
  for (const t of teardowns) {
    teardownDevice.set(t.id, t.device.id);
    if (!latest.has(t.device.id)) latest.set(t.device.id, t);
  }
  if (!teardowns.length) return [];
  const latestIds = [...latest.values()].map((t) => t.id);
  const [packs, findings, inputs] = await Promise.all([
    findInChunks(latestIds, (chunk) => em.find(PackSchema, { teardown: { $in: chunk } })),
    findInChunks(
      teardowns.map((t) => t.id),
      (chunk) => em.find(FindingSchema, { teardown: { $in: chunk } }, { fields: ['kind', 'severity', 'teardown'] as never }),
    ),
    figureInputs(em, [...latest.values()]),
  ]);
  const packOf = new Map(packs.map((p) => [refId(p.teardown), p]));
  const findingsOf = groupBy(
    findings.map((f) => ({ deviceId: teardownDevice.get(refId(f.teardown))!, kind: f.kind, severity: f.severity })),
    (f) => f.deviceId,
  );
  const judged: Judged[] = [];
  for (const t of latest.values()) {
    let input: TeardownFigureInput | null = null;
    let figures: TeardownFiguresResult | null = null;
    try {
      input = inputs.get(t.id)!;
      figures = teardownFigures(input);
    } catch (err) {
      // Records the calculation refuses (the figures panel names the field): this device is not judged.
      if (!(err instanceof RangeError)) throw err;
      input = null;
    }
    judged.push({
      device: { id: t.device.id, maker: t.device.maker, model: t.device.model, category: t.device.category, teardownId: t.id },
      teardown: t,
      input,
      figures,
      pack: packOf.get(t.id) ?? null,
      findings: findingsOf.get(t.device.id) ?? [],
    });
  }
  return judged.sort((a, b) => `${a.device.maker} ${a.device.model}`.localeCompare(`${b.device.maker} ${b.device.model}`));
}

/** GET /api/patterns */
export async function computePatterns(em: EntityManager, user: AuthUser): Promise<PatternsResponse> {
  const [judged, settings] = await Promise.all([judgeDevices(em, user), getSettings(em)]);
  const patterns: Pattern[] = rules(settings.capacityWarnFraction).map((rule) => {
    const verdicts = judged.map((j) => ({ j, v: rule.judge(j) })).filter((x) => x.v !== undefined);
    const hits = verdicts.filter((x) => x.v === true).map((x) => x.j.device);
    return {
      key: rule.key,
      title: rule.title,
      label: rule.sentence(hits.length, verdicts.length),
      count: hits.length,
      of: verdicts.length,
      deviceIds: hits.map((d) => d.id),
      devices: hits,
      basis: rule.basis,
      safety: rule.safety,
    };
  });
  return { patterns, note: ESTIMATES_NOTE };
}
