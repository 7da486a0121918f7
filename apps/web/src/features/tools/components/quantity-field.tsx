import type { ParsedToolInput } from '@splitcase/contracts';
import { Field, Input } from '@/components/field';
import { formatFigure } from './format-figure';

/**
 * A typed quantity: the text as entered, and under it what the server read it as (SI, with a
 * prefix) or the server's message for this field.
 */
export function QuantityField({
  label,
  name,
  value,
  onChange,
  placeholder,
  hint,
  error,
  parsed,
  mono = false,
}: {
  label: string;
  name: string;
  value: string;
  onChange: (value: string) => void;
  placeholder?: string;
  hint?: string;
  error?: string | undefined;
  parsed?: ParsedToolInput | undefined;
  mono?: boolean;
}) {
  const stale = parsed && parsed.entered !== value.trim();
  const readAs =
    parsed && !stale ? (
      <span title={`${parsed.value} ${parsed.unit}`.trim()} data-testid={`parsed-${name}`}>
        read as <span className="num font-medium text-graphite-700">{formatFigure(parsed.value, parsed.unit)}</span>
      </span>
    ) : (
      hint
    );
  return (
    <Field label={label} error={error} hint={readAs}>
      {(props) => (
        <Input
          {...props}
          name={name}
          value={value}
          onChange={(e) => onChange(e.target.value)}
          placeholder={placeholder}
          autoComplete="off"
          spellCheck={false}
          className={`h-11 text-base ${mono ? 'font-mono' : ''}`}
        />
      )}
    </Field>
  );
}
