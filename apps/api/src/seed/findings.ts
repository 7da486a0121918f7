// Demo findings, comments and review history for every demo teardown, coherent with each device's
// design in scenario.ts. Invented wording. Parts are linked when the parts step has recorded them
// (matched by category and description), photos when the photos step has made them (matched by
// caption); without them the findings stand alone.
import type { FindingKind, PartCategory, Role, Severity } from '@splitcase/contracts';
import { AuditEntrySchema } from '../modules/audit/audit-entry.entity';
import { findingSummary } from '../modules/findings/finding.service';
import { FindingSchema } from '../modules/findings/finding.entity';
import { PartSchema, type Part } from '../modules/parts/part.entity';
import { PhotoSchema } from '../modules/photos/photo.entity';
import { CommentSchema } from '../modules/teardowns/comment.entity';
import { SuggestionDecisionSchema } from '../modules/teardowns/suggestion-decision.entity';
import { TeardownSchema, type Teardown } from '../modules/teardowns/teardown.entity';
import { UserSchema, type User } from '../modules/users/user.entity';
import type { SeedContext } from './context';
import { DEMO_DEVICES, teardownRef, type DemoDevice } from './scenario';

type Who = Role | 'engineer2' | 'author';

interface DemoFinding {
  kind: FindingKind;
  severity: Severity;
  text: string;
  tags: string[];
  /** Parts to link, by category and (optionally) a word of the description. */
  parts?: { category: PartCategory; match?: RegExp }[];
  /** Accepted from this suggested-finding rule. */
  suggestionKey?: string;
  /** Photos to link, by a word of their caption (when the photos step has made any). */
  photos?: RegExp;
}

interface DemoEvent {
  at: string;
  who: Who;
  kind: 'comment' | 'submitted' | 'sent-back' | 'approved';
  body: string;
}

const FINDINGS: Record<string, DemoFinding[]> = {
  'halvix-duo': [
    {
      kind: 'safety',
      severity: 'major',
      suggestionKey: 'thermal.no-sensor',
      text: 'No temperature sensor anywhere: not on the board, not on either heater flex. The three heat levels are fixed PWM duties, so nothing limits the surface temperature when the heater is covered or pressed against skin. We saw 55 °C on the highest level after 10 minutes in free air.',
      tags: ['thermal', 'sensing'],
      parts: [{ category: 'heater' }, { category: 'ic', match: /micro|mcu|controller/i }],
      photos: /heater|flex/i,
    },
    {
      kind: 'user-experience',
      severity: 'minor',
      text: 'Heat levels are open-loop PWM duties that are not corrected for cell voltage: the warmth you feel on a level falls as the cell discharges.',
      tags: ['pwm', 'heat-levels'],
      parts: [
        { category: 'ic', match: /micro|mcu|controller/i },
        { category: 'semiconductor', match: /mosfet/i },
      ],
    },
    {
      kind: 'compliance',
      severity: 'major',
      suggestionKey: 'capacity.implausible',
      text: 'The label claims 5200 mAh, but the pack is one 2.7 Ah 18650 cell weighing 46 g. 5.2 Ah at 3.7 V in 46 g would be about 420 Wh/kg, far beyond what Li-ion cells reach; the bench run delivered 2.62 Ah.',
      tags: ['label-claim', 'capacity'],
      parts: [{ category: 'cell' }],
    },
    {
      kind: 'clever-idea',
      severity: 'note',
      text: 'Cell tabs are spot-welded to nickel strip, not soldered: no heat goes into the can during assembly and the joint stays low-resistance at the 2.4 A heater current.',
      tags: ['cell-joining', 'assembly'],
      parts: [{ category: 'cell' }],
      photos: /cell|tab|weld/i,
    },
    {
      kind: 'clever-idea',
      severity: 'note',
      text: 'One bidirectional buck-boost IC with a single shared inductor does both the USB charging (buck) and the 5 V power-bank output (boost): one IC and one inductor where most designs use a charger plus a separate boost stage.',
      tags: ['power-path', 'bom-reduction'],
      parts: [{ category: 'ic', match: /buck|boost|charg/i }, { category: 'inductor' }],
      photos: /board|pcb|inductor/i,
    },
    {
      kind: 'cost-down',
      severity: 'minor',
      text: 'Sharing the inductor between charging and output removes about one inductor and one IC from the BOM; worth costing for our own heater, with the caveat that charging and output cannot run at the same time.',
      tags: ['bom-reduction', 'power-path'],
      parts: [{ category: 'inductor' }],
    },
    {
      kind: 'safety',
      severity: 'minor',
      text: "No separate protection IC on the cell: the charger IC's own under-voltage cut-off is the only guard against the heaters draining the cell too far.",
      tags: ['protection'],
      parts: [{ category: 'cell' }],
    },
  ],
  'zestora-pocketsun': [
    {
      kind: 'clever-idea',
      severity: 'note',
      text: 'An NTC taped to the aluminium plate closes the loop: the controller holds the plate near its set point instead of running a fixed duty.',
      tags: ['thermal', 'sensing'],
      parts: [{ category: 'sensor' }],
    },
    {
      kind: 'reliability',
      severity: 'minor',
      text: 'The NTC is held by polyimide tape only. If the tape lifts, the controller reads air instead of the plate and drives the heater harder.',
      tags: ['thermal', 'assembly'],
      parts: [{ category: 'sensor' }],
    },
    {
      kind: 'cost-down',
      severity: 'note',
      text: 'Pouch cell soldered straight to a small protection board, no connector: cheaper than a plug, but the cell cannot be replaced.',
      tags: ['cell-joining'],
      parts: [{ category: 'cell' }],
    },
  ],
  'halvix-pro': [
    {
      kind: 'clever-idea',
      severity: 'note',
      text: 'An NTC is bonded to each heater flex and read by the controller: the heat levels regulate on temperature, unlike the Duo.',
      tags: ['thermal', 'sensing'],
      parts: [{ category: 'sensor' }],
    },
    {
      kind: 'safety',
      severity: 'note',
      text: 'Dedicated protection IC with a dual MOSFET on the 1S2P pack: over-charge, over-discharge and short-circuit cut-off are all covered.',
      tags: ['protection'],
      parts: [{ category: 'ic', match: /protect/i }],
    },
    {
      kind: 'manufacturability',
      severity: 'minor',
      text: 'The two cells are welded to a shared strip and then hot-glued to the frame: any rework means cutting the strip.',
      tags: ['assembly', 'cell-joining'],
      parts: [{ category: 'cell' }],
    },
    {
      kind: 'user-experience',
      severity: 'minor',
      text: 'USB-C output offers 5 V only; phones that could take faster charging get 10 W at most.',
      tags: ['usb-c'],
      parts: [{ category: 'connector' }],
    },
  ],
  'pellam-10': [
    {
      kind: 'compliance',
      severity: 'note',
      text: 'The label gives both 10 000 mAh and 37 Wh. The 1S3P pack of 3.35 Ah cells is 10.05 Ah and 37.2 Wh at 3.7 V, so both claims hold.',
      tags: ['label-claim'],
      parts: [{ category: 'cell' }],
    },
    {
      kind: 'user-experience',
      severity: 'note',
      text: 'The boost stage measured 87 % efficient at 2 A: about 6.4 Ah reaches the port at 5 V, which is what an honest 10 000 mAh bank delivers.',
      tags: ['efficiency'],
      parts: [{ category: 'ic', match: /boost/i }],
    },
    {
      kind: 'manufacturability',
      severity: 'minor',
      text: 'Cells welded to one nickel strip and wedged in foam blocks: quick to assemble, but the foam hides the welds from inspection.',
      tags: ['assembly'],
    },
    {
      kind: 'reliability',
      severity: 'note',
      text: "NTC on the pack read by the charger IC: charging stops above the cells' temperature limit.",
      tags: ['thermal', 'sensing'],
      parts: [{ category: 'sensor' }],
    },
  ],
  'pellam-20': [
    {
      kind: 'reliability',
      severity: 'minor',
      text: 'The four-switch buck-boost stage runs warm at 20 W: the inductor reached 62 °C in free air after 15 minutes.',
      tags: ['thermal', 'power-path'],
      parts: [{ category: 'inductor' }],
    },
    {
      kind: 'cost-down',
      severity: 'minor',
      text: 'Six parallel 3.35 Ah cells reach the 74 Wh label; four larger-format cells of about 5 Ah would do the same with fewer welds. Worth costing both.',
      tags: ['cells', 'bom-reduction'],
      parts: [{ category: 'cell' }],
    },
    {
      kind: 'compliance',
      severity: 'note',
      text: 'Pack is 74.4 Wh by its rating: under the 100 Wh limit, so it may travel in cabin baggage without airline approval.',
      tags: ['air-transport'],
    },
  ],
  'zestora-slimvolt': [
    {
      kind: 'compliance',
      severity: 'major',
      suggestionKey: 'capacity.implausible',
      text: 'The pouch cell delivered 4.05 Ah at 0.2 C against the 5000 mAh on the label: 81 %, below our 90 % warning level.',
      tags: ['label-claim', 'capacity'],
      parts: [{ category: 'cell' }],
    },
    {
      kind: 'safety',
      severity: 'major',
      text: 'The cell arrived slightly swollen. It was photographed and kept in the fire-safe box after the capacity run; the pack was not opened further.',
      tags: ['swelling', 'cells'],
      parts: [{ category: 'cell' }],
    },
    {
      kind: 'user-experience',
      severity: 'minor',
      text: 'Output conversion measured at 80 %: about 14.8 Wh reaches the USB port, or about 2 960 mAh at 5 V from a bank sold as 5000 mAh.',
      tags: ['efficiency', 'label-claim'],
    },
    {
      kind: 'cost-down',
      severity: 'note',
      text: 'One IC handles charging, the boost output and the charge-level LEDs.',
      tags: ['bom-reduction'],
      parts: [{ category: 'ic' }],
    },
  ],
  'nordwick-ridgeline': [
    {
      kind: 'clever-idea',
      severity: 'note',
      text: 'The pouch cell plugs in on a two-pin connector: a user can replace it without soldering.',
      tags: ['serviceability'],
      parts: [{ category: 'connector' }],
    },
    {
      kind: 'clever-idea',
      severity: 'note',
      text: 'An NTC on the LED board drives a thermal step-down: the buck driver cuts the LED current when the board gets hot.',
      tags: ['thermal', 'sensing'],
      parts: [{ category: 'sensor' }],
    },
    {
      kind: 'safety',
      severity: 'note',
      text: 'At full output the LED is too bright to look into, and there is no warning near the lens.',
      tags: ['optical'],
      parts: [{ category: 'led' }],
    },
    {
      kind: 'manufacturability',
      severity: 'minor',
      text: 'The LED board is held by two screws into plastic bosses; its heat path to the housing relies on one thin gap pad.',
      tags: ['thermal', 'assembly'],
    },
  ],
  'brightlark-trailbeam': [
    {
      kind: 'user-experience',
      severity: 'minor',
      text: 'LEDs run straight off the cell through ballast resistors: the light dims steadily as the cell discharges; there is no regulated mode.',
      tags: ['led-drive'],
      parts: [{ category: 'led' }, { category: 'passive' }],
    },
    {
      kind: 'reliability',
      severity: 'minor',
      text: 'The spring holder contacts are thin plated steel; their voltage drop is visible at the 1.2 A full-output current.',
      tags: ['contacts'],
    },
    {
      kind: 'cost-down',
      severity: 'note',
      text: 'No driver IC at all: one MOSFET and two resistors set the light output.',
      tags: ['bom-reduction', 'led-drive'],
      parts: [{ category: 'semiconductor' }],
    },
  ],
  'corvane-pocket': [
    {
      kind: 'compliance',
      severity: 'critical',
      suggestionKey: 'capacity.implausible',
      text: 'Sold as 2000 mAh; the cell inside is rated 1.2 Ah and delivered 1.15 Ah on the bench, 57 % of the label.',
      tags: ['label-claim', 'capacity'],
      parts: [{ category: 'cell' }],
    },
    {
      kind: 'safety',
      severity: 'major',
      text: "Wires are soldered straight onto the cell can. The heat needed to solder to a can can damage the cell's seal and separator.",
      tags: ['cell-joining'],
      parts: [{ category: 'cell' }, { category: 'wire' }],
    },
    {
      kind: 'safety',
      severity: 'major',
      suggestionKey: 'pack.no-protection',
      text: 'No protection circuit: the linear charger has no over-discharge cut-off, so the motor can drain the cell below its safe voltage.',
      tags: ['protection'],
      parts: [{ category: 'cell' }],
    },
    {
      kind: 'cost-down',
      severity: 'note',
      text: 'Linear charger IC and a bare brushed motor under PWM: about the cheapest power path there is.',
      tags: ['bom-reduction'],
      parts: [{ category: 'motor' }],
    },
  ],
  'corvane-neck': [
    {
      kind: 'compliance',
      severity: 'note',
      text: "The label's 4000 mAh matches the 2P pack of 2.0 Ah cells (3.88 Ah measured together).",
      tags: ['label-claim'],
      parts: [{ category: 'cell' }],
    },
    {
      kind: 'clever-idea',
      severity: 'note',
      text: 'Brushless blowers with integrated drivers: quiet, nothing to wear out, at a higher motor cost than brushed fans.',
      tags: ['motors'],
      parts: [{ category: 'motor' }],
    },
    {
      kind: 'user-experience',
      severity: 'minor',
      text: 'The intakes sit close to the hair line and the grille is coarse enough to pull in long hair.',
      tags: ['ergonomics'],
    },
  ],
};

/** Comments and review decisions (times in UTC on the teardown's date unless given in full). */
const EVENTS: Record<string, DemoEvent[]> = {
  'halvix-duo': [
    { at: 'T16:00', who: 'author', kind: 'submitted', body: 'Ready for review: both layers photographed, parts, power system and findings in.' },
    { at: 'T16:40', who: 'lead', kind: 'comment', body: 'Good catch on the missing sensor. Can the 10-minute surface log go in as a thermal run?' },
    { at: 'T17:20', who: 'author', kind: 'comment', body: 'Added the thermocouple log as a thermal run; the plateau is about 55 °C.' },
    { at: 'T18:00', who: 'lead', kind: 'approved', body: 'Approved. This one goes into the heater comparison.' },
  ],
  'zestora-pocketsun': [
    { at: 'T16:00', who: 'author', kind: 'submitted', body: 'Submitted for review.' },
    { at: 'T18:00', who: 'lead', kind: 'approved', body: 'Approved: the reference for closed-loop control in the set.' },
  ],
  'halvix-pro': [
    { at: 'T10:30', who: 'author', kind: 'submitted', body: 'Submitted for review.' },
    { at: 'T13:15', who: 'lead', kind: 'sent-back', body: 'The summary says both heater flexes carry an NTC, but the parts list has only one. Please record the second one.' },
    { at: 'T15:45', who: 'author', kind: 'comment', body: 'Second NTC added on the rear flex.' },
    { at: 'T16:00', who: 'author', kind: 'submitted', body: 'Resubmitted with the second NTC.' },
    { at: 'T16:30', who: 'sourcing', kind: 'comment', body: 'Pricing the protection IC and the second cell next week.' },
  ],
  'pellam-10': [
    { at: 'T16:00', who: 'author', kind: 'submitted', body: 'Submitted for review.' },
    { at: 'T18:00', who: 'lead', kind: 'approved', body: 'Approved.' },
  ],
  'zestora-slimvolt': [
    { at: 'T16:00', who: 'author', kind: 'submitted', body: 'Submitted. The cell was swollen on arrival; see the safety notes.' },
    { at: 'T17:10', who: 'lead', kind: 'comment', body: 'Fine to stop at the capacity run. Keep the cell in the fire-safe box until disposal.' },
    { at: 'T18:00', who: 'lead', kind: 'approved', body: 'Approved.' },
  ],
  'nordwick-ridgeline': [
    { at: 'T16:00', who: 'author', kind: 'submitted', body: 'Submitted for review.' },
    { at: 'T18:00', who: 'lead', kind: 'approved', body: 'Approved.' },
  ],
  'corvane-pocket': [
    { at: 'T16:00', who: 'author', kind: 'submitted', body: 'Submitted for review.' },
    { at: 'T18:00', who: 'lead', kind: 'approved', body: 'Approved. Flag the capacity claim in the monthly summary.' },
  ],
  'corvane-neck': [
    { at: 'T16:00', who: 'author', kind: 'submitted', body: 'Submitted for review.' },
    { at: 'T17:00', who: 'lead', kind: 'comment', body: 'Reading it tomorrow morning.' },
  ],
  'pellam-20': [{ at: 'T15:00', who: 'author', kind: 'comment', body: 'Note to self: repeat the capacity run at 9 V output before submitting.' }],
  'brightlark-trailbeam': [],
};

const AUDIT_ACTION = { comment: 'comment.created', submitted: 'teardown.submitted', 'sent-back': 'teardown.sent-back', approved: 'teardown.approved' } as const;
const STATUS_CHANGE = {
  submitted: { from: 'draft', to: 'in_review' },
  'sent-back': { from: 'in_review', to: 'draft' },
  approved: { from: 'in_review', to: 'published' },
} as const;

function pickParts(parts: Part[], wanted: DemoFinding['parts']): Part[] {
  const out: Part[] = [];
  for (const w of wanted ?? []) {
    const match = parts.filter((p) => p.category === w.category && (!w.match || w.match.test(`${p.description} ${p.notes ?? ''}`)));
    for (const p of match.slice(0, 2)) if (!out.includes(p)) out.push(p);
  }
  return out;
}

export async function seedFindings(ctx: SeedContext): Promise<void> {
  const { em } = ctx;
  const engineer2 = await em.findOneOrFail(UserSchema, { email: 'engineer2@splitcase.test' });
  for (const d of DEMO_DEVICES) {
    const t = await findTeardown(ctx, d);
    if (!t) continue;
    const author: User = t.engineer;
    const who = (w: Who): User => (w === 'author' ? author : w === 'engineer2' ? engineer2 : ctx.users[w]);
    const day = (at: string) => new Date(at.startsWith('T') ? `${t.date}${at}:00Z` : at);
    const audit = (at: Date, actor: User, action: string, entityType: string, entityId: number | string, summary: string, changes?: Record<string, { from: unknown; to: unknown }>) =>
      em.create(AuditEntrySchema, {
        at,
        actor,
        action,
        entityType,
        entityId: String(entityId),
        scopeType: 'teardown',
        scopeId: String(t.id),
        summary: summary.slice(0, 500),
        changes: changes ?? null,
      } as never);

    audit(day('T09:00'), author, 'teardown.created', 'teardown', t.id, `Started a teardown of ${d.maker} ${d.model} (${t.unitLabel ?? 'unit'}) dated ${t.date}`);

    const parts = await em.find(PartSchema, { teardown: t.id }, { orderBy: { position: 'asc', id: 'asc' } });
    const photos = await em.find(PhotoSchema, { teardown: t.id }, { orderBy: { layer: 'asc', step: 'asc', id: 'asc' } });
    let minute = 0;
    for (const f of FINDINGS[d.key] ?? []) {
      const at = new Date(day('T09:30').getTime() + minute * 60_000);
      minute += 17;
      const finding = em.create(FindingSchema, {
        teardown: t,
        kind: f.kind,
        severity: f.severity,
        text: f.text,
        tags: f.tags,
        suggestionKey: f.suggestionKey ?? null,
        createdBy: author,
        createdAt: at,
        updatedAt: at,
      } as never);
      finding.parts.set(pickParts(parts, f.parts));
      if (f.photos) finding.photos.set(photos.filter((p) => f.photos!.test(p.caption ?? '')).slice(0, 2));
      await em.flush();
      if (f.suggestionKey) {
        em.create(SuggestionDecisionSchema, { teardown: t, key: f.suggestionKey, status: 'accepted', findingId: finding.id, decidedBy: author, decidedAt: at } as never);
      }
      audit(at, author, 'finding.created', 'finding', finding.id, findingSummary(f) + (f.suggestionKey ? ` (accepted suggestion ${f.suggestionKey})` : ''));
    }

    let lastNote: string | null = null;
    for (const e of EVENTS[d.key] ?? []) {
      const at = day(e.at);
      const actor = who(e.who);
      const c = em.create(CommentSchema, { teardown: t, author: actor, kind: e.kind, body: e.body, createdAt: at } as never);
      await em.flush();
      const summary =
        e.kind === 'comment' ? `Commented: ${e.body}` : e.kind === 'submitted' ? 'Submitted for review' : e.kind === 'approved' ? `Approved and published: ${e.body}` : `Sent back to draft: ${e.body}`;
      audit(
        at,
        actor,
        AUDIT_ACTION[e.kind],
        e.kind === 'comment' ? 'comment' : 'teardown',
        e.kind === 'comment' ? c.id : t.id,
        summary,
        e.kind === 'comment' ? undefined : { status: STATUS_CHANGE[e.kind] },
      );
      if (e.kind === 'sent-back') lastNote = e.body;
      if (e.kind === 'approved' && e.body !== 'Approved.') lastNote = e.body;
    }
    if (lastNote) t.lastReviewNote = lastNote;
    await em.flush();
  }
}

async function findTeardown(ctx: SeedContext, d: DemoDevice): Promise<Teardown | null> {
  const id = ctx.refs.get(teardownRef(d.key)) as number | undefined;
  const where = id ? { id } : { device: { maker: d.maker, model: d.model } };
  return ctx.em.findOne(TeardownSchema, where as never, { populate: ['engineer'], orderBy: { id: 'asc' } });
}
