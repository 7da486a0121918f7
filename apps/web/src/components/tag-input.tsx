import { useState, type KeyboardEvent } from 'react';
import { X } from 'lucide-react';
import { inputClass } from './field';

/** Tags as chips: type and press Enter or comma to add, Backspace on an empty box removes the last. */
export function TagInput({
  value,
  onChange,
  id,
  placeholder = 'Add a tag and press Enter',
  ...aria
}: {
  value: string[];
  onChange: (tags: string[]) => void;
  id?: string;
  placeholder?: string;
  'aria-invalid'?: boolean;
  'aria-describedby'?: string;
}) {
  const [draft, setDraft] = useState('');
  const add = (raw: string) => {
    const tags = raw
      .split(',')
      .map((t) => t.trim().toLowerCase())
      .filter(Boolean);
    if (tags.length) onChange([...new Set([...value, ...tags])]);
    setDraft('');
  };
  const onKeyDown = (e: KeyboardEvent<HTMLInputElement>) => {
    if (e.key === 'Enter' || e.key === ',') {
      e.preventDefault();
      add(draft);
    } else if (e.key === 'Backspace' && draft === '' && value.length) onChange(value.slice(0, -1));
  };
  return (
    <div className={`${inputClass} flex min-h-9 flex-wrap items-center gap-1 py-1`} aria-invalid={aria['aria-invalid']}>
      {value.map((t) => (
        <span key={t} className="inline-flex items-center gap-0.5 rounded bg-graphite-100 py-0.5 pl-1.5 pr-0.5 text-xs text-graphite-800">
          {t}
          <button type="button" onClick={() => onChange(value.filter((x) => x !== t))} aria-label={`Remove tag ${t}`} className="rounded p-0.5 hover:bg-graphite-200">
            <X className="size-3" aria-hidden />
          </button>
        </span>
      ))}
      <input
        id={id}
        value={draft}
        onChange={(e) => setDraft(e.target.value)}
        onKeyDown={onKeyDown}
        onBlur={() => draft && add(draft)}
        placeholder={value.length ? '' : placeholder}
        aria-describedby={aria['aria-describedby']}
        className="h-7 min-w-24 flex-1 border-0 bg-transparent p-0 text-sm focus:outline-none focus:ring-0"
      />
    </div>
  );
}
