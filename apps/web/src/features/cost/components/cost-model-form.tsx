import { useState, type ReactNode } from 'react';
import { Plus, Trash2 } from 'lucide-react';
import { INSURANCE_BASIS, PART_CATEGORY, type CostModelBody, type CostModelDto, type InsuranceBasisKey, type PartCategory } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { Field, Input, FormError, LabelledOptions, Select } from '@/components/field';
import { ApiError } from '@/lib/api-client';
import { plain, toPercentText } from './display';

type Draft = Record<string, string>;
const PERCENT = ['defaultAttrition', 'firstPassYield', 'overheadFraction', 'freightFraction', 'insuranceFraction', 'dutyFraction', 'retailMarginFraction', 'platformMarginFraction'] as const;
const MONEY = ['smtCostPerPlacement', 'thtCostPerJoint', 'labourRatePerHour', 'packagingCost'] as const;
const PLAIN = ['thtJointsPerPart', 'testMinutes'] as const;
const BANDS = ['high', 'medium', 'low'] as const;

function toDraft(m: CostModelDto): { draft: Draft; ops: { label: string; minutes: string }[] } {
  const draft: Draft = { currency: m.currency, volumes: m.volumes.join(', '), insuranceBasis: m.insuranceBasis };
  for (const k of PERCENT) draft[k] = toPercentText(m[k]);
  for (const k of MONEY) draft[k] = plain(m[k]);
  for (const k of PLAIN) draft[k] = plain(m[k]);
  for (const b of BANDS) draft[`band.${b}`] = toPercentText(m.confidenceBand[b]);
  for (const c of PART_CATEGORY.values) {
    const v = m.attritionByCategory[c];
    draft[`attrition.${c}`] = v === undefined ? '' : toPercentText(v);
  }
  return { draft, ops: m.manualOperations.map((o) => ({ label: o.label, minutes: plain(o.minutes) })) };
}

/** Blank → NaN, which travels as null: the server names the field that needs a number. */
const num = (s: string | undefined) => (s === undefined || s.trim() === '' ? Number.NaN : Number(s.replace(',', '.')));
/** A volume as typed: 5000, 5k, 1.5k or 2M units. */
const volumeTyped = (s: string) => {
  const m = s.trim().match(/^([\d.]+)\s*([kKmM]?)$/);
  if (!m) return Number.NaN;
  if (m[2] === '') return Number(m[1]);
  // Round away float noise of the prefix (1.1k → 1100, not 1100.0000000000002).
  return Number((Number(m[1]) * (m[2]!.toLowerCase() === 'k' ? 1e3 : 1e6)).toPrecision(12));
};
/** Percent typed → share sent (2.7 → 0.027); the server checks the range. */
const share = (s: string | undefined) => num(s) / 100;

function toBody(d: Draft, ops: { label: string; minutes: string }[]): CostModelBody {
  const attritionByCategory: Partial<Record<PartCategory, number>> = {};
  for (const c of PART_CATEGORY.values) if ((d[`attrition.${c}`] ?? '').trim() !== '') attritionByCategory[c] = share(d[`attrition.${c}`]);
  return {
    currency: (d.currency ?? '').trim(),
    volumes: (d.volumes ?? '')
      .split(/[,;\s]+/)
      .filter(Boolean)
      .map(volumeTyped),
    attritionByCategory,
    defaultAttrition: share(d.defaultAttrition),
    smtCostPerPlacement: num(d.smtCostPerPlacement),
    thtCostPerJoint: num(d.thtCostPerJoint),
    thtJointsPerPart: num(d.thtJointsPerPart),
    manualOperations: ops.map((o) => ({ label: o.label, minutes: num(o.minutes) })),
    labourRatePerHour: num(d.labourRatePerHour),
    testMinutes: num(d.testMinutes),
    packagingCost: num(d.packagingCost),
    firstPassYield: share(d.firstPassYield),
    overheadFraction: share(d.overheadFraction),
    freightFraction: share(d.freightFraction),
    insuranceFraction: share(d.insuranceFraction),
    insuranceBasis: (d.insuranceBasis ?? 'cif') as InsuranceBasisKey,
    dutyFraction: share(d.dutyFraction),
    retailMarginFraction: share(d.retailMarginFraction),
    platformMarginFraction: share(d.platformMarginFraction),
    confidenceBand: { high: share(d['band.high']), medium: share(d['band.medium']), low: share(d['band.low']) },
  };
}

function Group({ title, children, note }: { title: string; children: ReactNode; note?: ReactNode }) {
  return (
    <fieldset className="rounded-md border border-graphite-150 p-3">
      <legend className="px-1 text-xs font-semibold uppercase tracking-wide text-graphite-600">{title}</legend>
      {note && <p className="mb-2 text-xs text-graphite-500">{note}</p>}
      <div className="grid grid-cols-2 gap-3 md:grid-cols-3">{children}</div>
    </fieldset>
  );
}

/**
 * The assumptions that turn a BOM into a should-cost. Shares are typed as percentages; the
 * server validates the model and names each field it refuses.
 */
export function CostModelForm({
  initial,
  onSubmit,
  submitLabel,
  busy,
  readOnly = false,
  extraActions,
}: {
  initial: CostModelDto;
  onSubmit: (body: CostModelBody) => Promise<unknown>;
  submitLabel: string;
  busy: boolean;
  readOnly?: boolean;
  extraActions?: ReactNode;
}) {
  const start = toDraft(initial);
  const [draft, setDraft] = useState<Draft>(start.draft);
  const [ops, setOps] = useState(start.ops);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const cur = (draft.currency ?? '').toUpperCase() || '…';

  const field = (key: string, label: ReactNode, opts: { unit?: string; errorKey?: string; hint?: string } = {}) => (
    <Field label={label} error={errors[opts.errorKey ?? key]} hint={opts.hint}>
      {(f) => (
        <div className="relative">
          <Input
            {...f}
            name={key}
            inputMode="decimal"
            readOnly={readOnly}
            value={draft[key] ?? ''}
            onChange={(e) => setDraft((d) => ({ ...d, [key]: e.target.value }))}
            className={`num ${opts.unit ? 'pr-14' : ''}`}
          />
          {opts.unit && <span className="pointer-events-none absolute inset-y-0 right-3 flex items-center text-xs text-graphite-500">{opts.unit}</span>}
        </div>
      )}
    </Field>
  );

  const submit = async () => {
    setErrors({});
    setFormError(null);
    try {
      await onSubmit(toBody(draft, ops));
    } catch (err) {
      if (err instanceof ApiError) {
        const mapped: Record<string, string> = {};
        for (const [k, v] of Object.entries(err.fields)) {
          const key = k.startsWith('volumes') ? 'volumes' : k.startsWith('confidenceBand.') ? `band.${k.split('.')[1]}` : k.startsWith('attritionByCategory.') ? `attrition.${k.split('.')[1]}` : k;
          mapped[key] ??= v;
        }
        setErrors(mapped);
        setFormError(err.message);
      } else setFormError(err instanceof Error ? err.message : 'The cost model could not be saved.');
    }
  };

  return (
    <form
      className="space-y-4"
      noValidate
      onSubmit={(e) => {
        e.preventDefault();
        if (!readOnly) void submit();
      }}
    >
      <Group title="Volumes and currency">
        {field('volumes', 'Production volumes', { hint: 'Units, small to large, e.g. 1k, 10k, 100k' })}
        <Field label="Model currency" error={errors.currency} hint="Of the money amounts below">
          {(f) => (
            <Input {...f} readOnly={readOnly} maxLength={3} value={draft.currency ?? ''} onChange={(e) => setDraft((d) => ({ ...d, currency: e.target.value.toUpperCase() }))} className="font-mono uppercase" />
          )}
        </Field>
      </Group>

      <Group title="Assembly, labour and test">
        {field('smtCostPerPlacement', 'SMT cost per placement', { unit: cur })}
        {field('thtCostPerJoint', 'Through-hole cost per joint', { unit: cur })}
        {field('thtJointsPerPart', 'Joints per through-hole part')}
        {field('labourRatePerHour', 'Labour rate', { unit: `${cur}/h` })}
        {field('testMinutes', 'Test time per unit', { unit: 'min' })}
        {field('packagingCost', 'Packing per unit', { unit: cur, hint: 'Beyond packaging parts in the BOM' })}
        {field('firstPassYield', 'First-pass yield', { unit: '%' })}
      </Group>

      <fieldset className="rounded-md border border-graphite-150 p-3">
        <legend className="px-1 text-xs font-semibold uppercase tracking-wide text-graphite-600">Manual operations (minutes × labour rate)</legend>
        <ul className="space-y-2">
          {ops.map((o, k) => (
            <li key={k} className="flex items-start gap-2">
              <div className="flex-1">
                <Input
                  aria-label={`Operation ${k + 1}`}
                  aria-invalid={Boolean(errors[`manualOperations.${k}.label`])}
                  readOnly={readOnly}
                  value={o.label}
                  placeholder="e.g. Spot-weld cell tabs"
                  onChange={(e) => setOps((list) => list.map((x, j) => (j === k ? { ...x, label: e.target.value } : x)))}
                />
                {errors[`manualOperations.${k}.label`] && <p className="mt-0.5 text-xs text-brick-700">{errors[`manualOperations.${k}.label`]}</p>}
              </div>
              <div className="w-32">
                <div className="relative">
                  <Input
                    aria-label={`Minutes of operation ${k + 1}`}
                    aria-invalid={Boolean(errors[`manualOperations.${k}.minutes`])}
                    readOnly={readOnly}
                    inputMode="decimal"
                    className="num pr-12"
                    value={o.minutes}
                    onChange={(e) => setOps((list) => list.map((x, j) => (j === k ? { ...x, minutes: e.target.value } : x)))}
                  />
                  <span className="pointer-events-none absolute inset-y-0 right-3 flex items-center text-xs text-graphite-500">min</span>
                </div>
                {errors[`manualOperations.${k}.minutes`] && <p className="mt-0.5 text-xs text-brick-700">{errors[`manualOperations.${k}.minutes`]}</p>}
              </div>
              {!readOnly && (
                <Button size="md" variant="ghost" aria-label={`Remove operation ${k + 1}`} onClick={() => setOps((list) => list.filter((_, j) => j !== k))}>
                  <Trash2 className="size-4" aria-hidden />
                </Button>
              )}
            </li>
          ))}
        </ul>
        {!readOnly && (
          <Button size="sm" variant="quiet" className="mt-2" onClick={() => setOps((list) => [...list, { label: '', minutes: '' }])}>
            <Plus className="size-4" aria-hidden /> Add an operation
          </Button>
        )}
      </fieldset>

      <Group title="Attrition (extra parts bought to cover losses)" note="Leave a category blank to use the default. Typical: passives 1–5 %, ICs 0.5–1 %.">
        {field('defaultAttrition', 'Default', { unit: '%' })}
        {PART_CATEGORY.values.map((c) => field(`attrition.${c}`, PART_CATEGORY.labels[c], { unit: '%' }))}
      </Group>

      <Group title="Overhead, freight and duty">
        {field('overheadFraction', 'Overhead', { unit: '%' })}
        {field('freightFraction', 'Freight', { unit: '%', hint: 'Share of the ex-works cost' })}
        {field('insuranceFraction', 'Insurance', { unit: '%', hint: 'Typical 0.5–2 %' })}
        <Field label="Insurance on" error={errors.insuranceBasis} hint="CIF: goods + freight, the value duty is levied on">
          {(f) => (
            <Select {...f} name="insuranceBasis" disabled={readOnly} value={draft.insuranceBasis ?? 'cif'} onChange={(e) => setDraft((d) => ({ ...d, insuranceBasis: e.target.value }))}>
              <LabelledOptions list={INSURANCE_BASIS} />
            </Select>
          )}
        </Field>
        {field('dutyFraction', 'Import duty', { unit: '%', hint: 'On the CIF value' })}
      </Group>

      <Group title="Channel margins (to compare with the retail price)">
        {field('retailMarginFraction', 'Retailer margin', { unit: '%', hint: 'Share of the retail price' })}
        {field('platformMarginFraction', 'Platform fee', { unit: '%', hint: 'Share of what the retailer passes on' })}
      </Group>

      <Group title="Confidence band (± on unit prices)">
        {field('band.high', 'High confidence', { unit: '± %' })}
        {field('band.medium', 'Medium confidence', { unit: '± %' })}
        {field('band.low', 'Low confidence', { unit: '± %' })}
      </Group>

      <FormError message={formError} />
      {!readOnly && (
        <div className="flex flex-wrap items-center gap-2">
          <Button type="submit" variant="primary" busy={busy}>
            {submitLabel}
          </Button>
          {extraActions}
        </div>
      )}
    </form>
  );
}
