import { useId } from 'react';

/** A choice of a few options as one row of large radio buttons (arrow keys move between them). */
export function Segmented<T extends string>({
  legend,
  value,
  options,
  onChange,
  name,
}: {
  legend: string;
  value: T;
  options: readonly { value: T; label: string }[];
  onChange: (value: T) => void;
  name?: string;
}) {
  const auto = useId();
  const group = name ?? auto;
  return (
    <fieldset>
      <legend className="mb-1 block text-sm font-medium text-graphite-800">{legend}</legend>
      <div className="flex flex-wrap gap-1 rounded-lg bg-graphite-100 p-1">
        {options.map((o) => (
          <label
            key={o.value}
            className={`flex min-h-10 flex-1 cursor-pointer items-center justify-center whitespace-nowrap rounded-md px-3 text-sm font-medium has-[:focus-visible]:outline has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-copper-500 ${value === o.value ? 'bg-white text-graphite-950 shadow-card ring-1 ring-graphite-150' : 'text-graphite-600 hover:text-graphite-900'}`}
          >
            <input type="radio" name={group} value={o.value} checked={value === o.value} onChange={() => onChange(o.value)} className="sr-only" />
            {o.label}
          </label>
        ))}
      </div>
    </fieldset>
  );
}
