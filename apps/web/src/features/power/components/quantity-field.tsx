import { useWatch, type FieldValues, type Path, type UseFormReturn } from 'react-hook-form';
import { bareHint, storedQuantityText, type QuantityField as FieldDeclaration } from '@splitcase/contracts';
import { Field, Input } from '@/components/field';
import { formatStored, sameQuantityText } from '@/lib/format';

/**
 * The text to show in a field: what the user typed last time, or the stored value with its stored
 * unit ("0.046 kg"), so that saving again never sends a bare number read in another unit.
 */
export const typedOr = (entered: Record<string, string> | undefined, key: string, value: number | null | undefined, field: FieldDeclaration) => entered?.[key] ?? storedQuantityText(value, field.kind);

/** What the engineer typed, with the stored value in SI beside it when the two read differently ("2700 mAh · 2.70 Ah"). */
export function TypedQuantity({ typed, si }: { typed: string | undefined; si: string }) {
  return typed && !sameQuantityText(typed, si) ? (
    <span>
      {typed} <span className="text-graphite-400">· {si}</span>
    </span>
  ) : (
    <span>{si}</span>
  );
}

/** One quantity of a card: its key, the unit its saved value is shown in (SI; '' for none shown). */
export interface QuantitySpec<K extends string> {
  key: K;
  unit: string;
}

/** A card's quantities in their order, from the unit each saved value is shown in: `{ nominalVolts: 'V', series: '' }`. */
export const quantityList = <K extends string>(units: Record<K, string>): readonly QuantitySpec<K>[] => (Object.keys(units) as K[]).map((key) => ({ key, unit: units[key] }));

/** A record of the power system as the API sends it: SI values by field and the text typed for each. */
type Saved<K extends string> = Record<K, number | null> & { entered: Record<string, string> };

/** The form's text of each quantity: the text typed last time (or the stored value with its unit), else `blank[key]` or ''. */
export function quantityTexts<K extends string>(
  list: readonly QuantitySpec<K>[],
  fields: Record<K, FieldDeclaration>,
  record: Saved<K> | null,
  blank: Partial<Record<K, string>> = {},
): Record<K, string> {
  return Object.fromEntries(list.map((f) => [f.key, record ? typedOr(record.entered, f.key, record[f.key], fields[f.key]) : (blank[f.key] ?? '')])) as Record<K, string>;
}

/** Field name → label as on screen, for a card's error summary. */
export const labelsOf = (fields: Record<string, FieldDeclaration>, prefix = ''): Record<string, string> => Object.fromEntries(Object.entries(fields).map(([k, f]) => [`${prefix}${k}`, f.label]));

/**
 * A field that takes units ("2700 mAh", "3.65V", "3R0"), registered on the card's form: label,
 * placeholder and the bare-number rule come from the field's declaration in contracts; with a saved
 * record, the saved value (SI, formatted) beside it ("= 2.70 Ah", or "saved: 2.70 Ah" once changed).
 */
export function QuantityField<V extends FieldValues, O>({
  form,
  name,
  field,
  unit,
  saved,
}: {
  form: UseFormReturn<V, unknown, O>;
  name: Path<V>;
  field: FieldDeclaration;
  unit: string;
  /** The saved value (SI) and the text the form started from. */
  saved?: { value: number | null; text: string };
}) {
  const value = useWatch({ control: form.control, name }) as string | undefined;
  const error = name.split('.').reduce<unknown>((e, k) => (e as Record<string, unknown> | undefined)?.[k], form.formState.errors) as { message?: string } | undefined;
  const dirty = saved !== undefined && (value ?? '').trim() !== saved.text.trim();
  const hint =
    saved && saved.value !== null && unit !== '' ? (
      <span className="num">
        {dirty ? 'saved: ' : '= '}
        {formatStored(saved.value, unit)}
      </span>
    ) : (
      <span>
        e.g. {field.placeholder} · {bareHint(field)}
      </span>
    );
  return (
    <Field label={field.label} error={error?.message} hint={hint}>
      {(p) => <Input {...p} {...form.register(name)} placeholder={field.placeholder} autoComplete="off" spellCheck={false} />}
    </Field>
  );
}

/** The quantities of a card in their order, each with its saved value when there is a record. */
export function QuantityFields<V extends FieldValues, O, K extends string>({
  form,
  list,
  fields,
  record,
  prefix = '',
}: {
  form: UseFormReturn<V, unknown, O>;
  list: readonly QuantitySpec<K>[];
  fields: Record<K, FieldDeclaration>;
  record?: Saved<K> | null;
  prefix?: string;
}) {
  return (
    <>
      {list.map((f) => (
        <QuantityField
          key={f.key}
          form={form}
          name={`${prefix}${f.key}` as Path<V>}
          field={fields[f.key]}
          unit={f.unit}
          saved={record ? { value: record[f.key], text: typedOr(record.entered, f.key, record[f.key], fields[f.key]) } : undefined}
        />
      ))}
    </>
  );
}
