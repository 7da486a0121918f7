import { useState, type ReactNode } from 'react';
import { useFieldArray, useForm, type FieldError, type Path } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Plus, Trash2 } from 'lucide-react';
import { costModelFormSchema, INSURANCE_BASIS, PART_CATEGORY, type CostModelBody, type CostModelDto, type CostModelFormValues } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { Field, Input, FormError, LabelledOptions, Select } from '@/components/field';
import { ApiError } from '@/lib/api-client';
import { plain, toPercentText } from './display';

const PERCENT = ['defaultAttrition', 'firstPassYield', 'overheadFraction', 'freightFraction', 'insuranceFraction', 'dutyFraction', 'retailMarginFraction', 'platformMarginFraction'] as const;
const PLAIN = ['smtCostPerPlacement', 'thtCostPerJoint', 'labourRatePerHour', 'packagingCost', 'thtJointsPerPart', 'testMinutes'] as const;

/** The model as the form shows it: shares as percentages, the volumes on one line. */
function toValues(m: CostModelDto): CostModelFormValues {
  const values = {
    currency: m.currency,
    volumes: m.volumes.join(', '),
    insuranceBasis: m.insuranceBasis,
    attritionByCategory: Object.fromEntries(PART_CATEGORY.values.map((c) => [c, m.attritionByCategory[c] === undefined ? '' : toPercentText(m.attritionByCategory[c])])),
    manualOperations: m.manualOperations.map((o) => ({ label: o.label, minutes: plain(o.minutes) })),
    confidenceBand: { high: toPercentText(m.confidenceBand.high), medium: toPercentText(m.confidenceBand.medium), low: toPercentText(m.confidenceBand.low) },
  } as CostModelFormValues;
  for (const k of PERCENT) values[k] = toPercentText(m[k]);
  for (const k of PLAIN) values[k] = plain(m[k]);
  return values;
}

/** The message of a field, or of the first item of a list field (a volume out of order names its place in the list). */
function messageOf(error: unknown): string | undefined {
  if (!error || typeof error !== 'object') return undefined;
  const e = error as FieldError & Record<number, FieldError | undefined>;
  if (e.message) return e.message;
  return Object.values(e).find((x): x is FieldError => Boolean(x && typeof x === 'object' && 'message' in x && x.message))?.message;
}

const CellError = ({ message }: { message: string | undefined }) => (message ? <p className="mt-0.5 text-xs text-brick-700">{message}</p> : null);

/** Where a field the server names sits in this form (each volume's message goes on the volumes line). */
const formField = (key: string) => (key.startsWith('volumes') ? 'volumes' : key);

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
  const [formError, setFormError] = useState<string | null>(null);
  const { register, control, handleSubmit, setError, watch, formState } = useForm<CostModelFormValues, unknown, CostModelBody>({
    resolver: zodResolver(costModelFormSchema),
    defaultValues: toValues(initial),
  });
  const ops = useFieldArray({ control, name: 'manualOperations' });
  const errors = formState.errors as Record<string, unknown>;
  const errorAt = (path: string) => messageOf(path.split('.').reduce<unknown>((e, k) => (e && typeof e === 'object' ? (e as Record<string, unknown>)[k] : undefined), errors));
  const cur = (watch('currency') ?? '').toUpperCase() || '…';

  const field = (key: Path<CostModelFormValues>, label: ReactNode, opts: { unit?: string; hint?: string } = {}) => (
    <Field key={key} label={label} error={errorAt(key)} hint={opts.hint}>
      {(f) => (
        <div className="relative">
          <Input {...f} inputMode="decimal" readOnly={readOnly} className={`num ${opts.unit ? 'pr-14' : ''}`} {...register(key)} />
          {opts.unit && <span className="pointer-events-none absolute inset-y-0 right-3 flex items-center text-xs text-graphite-500">{opts.unit}</span>}
        </div>
      )}
    </Field>
  );

  const submit = handleSubmit(async (body) => {
    setFormError(null);
    try {
      await onSubmit(body);
    } catch (err) {
      if (err instanceof ApiError) {
        for (const [k, v] of Object.entries(err.fields)) setError(formField(k) as Path<CostModelFormValues>, { type: 'server', message: v });
        setFormError(err.message);
      } else setFormError(err instanceof Error ? err.message : 'The cost model could not be saved.');
    }
  });

  return (
    <form
      className="space-y-4"
      noValidate
      onSubmit={(e) => {
        if (readOnly) e.preventDefault();
        else void submit(e);
      }}
    >
      <Group title="Volumes and currency">
        {field('volumes', 'Production volumes', { hint: 'Units, small to large, e.g. 1k, 10k, 100k' })}
        <Field label="Model currency" error={errorAt('currency')} hint="Of the money amounts below">
          {(f) => <Input {...f} readOnly={readOnly} maxLength={3} className="font-mono uppercase" {...register('currency')} />}
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
          {ops.fields.map((o, k) => (
            <li key={o.id} className="flex items-start gap-2">
              <div className="flex-1">
                <Input
                  aria-label={`Operation ${k + 1}`}
                  aria-invalid={Boolean(errorAt(`manualOperations.${k}.label`))}
                  readOnly={readOnly}
                  placeholder="e.g. Spot-weld cell tabs"
                  {...register(`manualOperations.${k}.label`)}
                />
                <CellError message={errorAt(`manualOperations.${k}.label`)} />
              </div>
              <div className="w-32">
                <div className="relative">
                  <Input
                    aria-label={`Minutes of operation ${k + 1}`}
                    aria-invalid={Boolean(errorAt(`manualOperations.${k}.minutes`))}
                    readOnly={readOnly}
                    inputMode="decimal"
                    className="num pr-12"
                    {...register(`manualOperations.${k}.minutes`)}
                  />
                  <span className="pointer-events-none absolute inset-y-0 right-3 flex items-center text-xs text-graphite-500">min</span>
                </div>
                <CellError message={errorAt(`manualOperations.${k}.minutes`)} />
              </div>
              {!readOnly && (
                <Button size="md" variant="ghost" aria-label={`Remove operation ${k + 1}`} onClick={() => ops.remove(k)}>
                  <Trash2 className="size-4" aria-hidden />
                </Button>
              )}
            </li>
          ))}
        </ul>
        {!readOnly && (
          <Button size="sm" variant="quiet" className="mt-2" onClick={() => ops.append({ label: '', minutes: '' })}>
            <Plus className="size-4" aria-hidden /> Add an operation
          </Button>
        )}
      </fieldset>

      <Group title="Attrition (extra parts bought to cover losses)" note="Leave a category blank to use the default. Typical: passives 1–5 %, ICs 0.5–1 %.">
        {field('defaultAttrition', 'Default', { unit: '%' })}
        {PART_CATEGORY.values.map((c) => field(`attritionByCategory.${c}`, PART_CATEGORY.labels[c], { unit: '%' }))}
      </Group>

      <Group title="Overhead, freight and duty">
        {field('overheadFraction', 'Overhead', { unit: '%' })}
        {field('freightFraction', 'Freight', { unit: '%', hint: 'Share of the ex-works cost' })}
        {field('insuranceFraction', 'Insurance', { unit: '%', hint: 'Typical 0.5–2 %' })}
        <Field label="Insurance on" error={errorAt('insuranceBasis')} hint="CIF: goods + freight, the value duty is levied on">
          {(f) => (
            <Select {...f} disabled={readOnly} {...register('insuranceBasis')}>
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
        {field('confidenceBand.high', 'High confidence', { unit: '± %' })}
        {field('confidenceBand.medium', 'Medium confidence', { unit: '± %' })}
        {field('confidenceBand.low', 'Low confidence', { unit: '± %' })}
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
