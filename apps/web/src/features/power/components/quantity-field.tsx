import { bareHint, storedQuantityText, type QuantityField as FieldDeclaration } from '@splitcase/contracts';
import { Field, Input } from '@/components/field';
import { formatStored, sameQuantityText } from '@/lib/format';

/**
 * The text to show in a field: what the user typed last time, or the stored value with its stored
 * unit ("0.046 kg"), so that saving again never sends a bare number read in another unit.
 */
export const typedOr = (entered: Record<string, string> | undefined, key: string, value: number | null | undefined, field: FieldDeclaration) =>
  entered?.[key] ?? storedQuantityText(value, field.kind);

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

/**
 * A field that takes units ("2700 mAh", "3.65V", "3R0"): label, placeholder and the bare-number rule
 * come from the field's declaration in contracts; shows the saved value (SI, formatted) beside it.
 */
export function QuantityField({
  field,
  value,
  onChange,
  error,
  saved,
  unit,
  name,
}: {
  field: FieldDeclaration;
  value: string;
  onChange: (v: string) => void;
  error?: string;
  /** The saved value (SI) and whether the field still shows the saved text. */
  saved?: { value: number | null; text: string };
  unit: string;
  name: string;
}) {
  const dirty = saved !== undefined && value.trim() !== saved.text.trim();
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
    <Field label={field.label} error={error} hint={hint}>
      {(p) => <Input {...p} name={name} value={value} placeholder={field.placeholder} autoComplete="off" spellCheck={false} onChange={(e) => onChange(e.target.value)} />}
    </Field>
  );
}
