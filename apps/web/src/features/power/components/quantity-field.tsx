import { Field, Input } from '@/components/field';
import { formatStored, sameQuantityText } from '@/lib/format';

/** The text to show in a field: what the user typed last time, or the stored SI number. */
export const typedOr = (entered: Record<string, string> | undefined, key: string, value: number | null | undefined) =>
  entered?.[key] ?? (value === null || value === undefined ? '' : String(value));

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

/** A number field that takes units ("2700 mAh", "3.65V", "3R0"); shows the saved SI value beside it. */
export function QuantityField({
  label,
  value,
  onChange,
  error,
  saved,
  unit,
  placeholder,
  name,
}: {
  label: string;
  value: string;
  onChange: (v: string) => void;
  error?: string;
  /** The saved value (SI) and whether the field still shows the saved text. */
  saved?: { value: number | null; text: string };
  unit: string;
  placeholder?: string;
  name: string;
}) {
  const dirty = saved !== undefined && value.trim() !== saved.text.trim();
  const hint =
    saved && saved.value !== null && unit !== '' ? (
      <span className="num">
        {dirty ? 'saved: ' : '= '}
        {formatStored(saved.value, unit)}
      </span>
    ) : saved ? undefined : (
      <span>{placeholder ? `e.g. ${placeholder}` : 'units welcome'}</span>
    );
  return (
    <Field label={label} error={error} hint={hint}>
      {(p) => <Input {...p} name={name} value={value} placeholder={placeholder} autoComplete="off" spellCheck={false} onChange={(e) => onChange(e.target.value)} />}
    </Field>
  );
}
