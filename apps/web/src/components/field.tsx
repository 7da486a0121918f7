import { forwardRef, useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes, type TextareaHTMLAttributes } from 'react';

export const inputClass =
  'block w-full rounded-md border border-graphite-200 bg-white px-3 text-sm text-graphite-950 placeholder:text-graphite-400 focus:border-copper-500 focus:outline-none focus:ring-2 focus:ring-copper-200 disabled:bg-graphite-50 aria-[invalid=true]:border-brick-600 aria-[invalid=true]:ring-brick-100';

export function Field({
  label,
  error,
  hint,
  children,
  id,
  className = '',
}: {
  label: ReactNode;
  error?: string;
  hint?: ReactNode;
  children: (props: { id: string; 'aria-invalid': boolean; 'aria-describedby'?: string }) => ReactNode;
  id?: string;
  className?: string;
}) {
  const auto = useId();
  const fieldId = id ?? auto;
  const describedBy = error ? `${fieldId}-error` : hint ? `${fieldId}-hint` : undefined;
  return (
    <div className={`space-y-1 ${className}`}>
      <label htmlFor={fieldId} className="block text-sm font-medium text-graphite-800">
        {label}
      </label>
      {children({ id: fieldId, 'aria-invalid': Boolean(error), 'aria-describedby': describedBy })}
      {error ? (
        <InlineError id={`${fieldId}-error`} message={error} />
      ) : hint ? (
        <p id={`${fieldId}-hint`} className="text-xs text-graphite-500">
          {hint}
        </p>
      ) : null}
    </div>
  );
}

export const Input = forwardRef<HTMLInputElement, InputHTMLAttributes<HTMLInputElement>>(function Input({ className = '', ...rest }, ref) {
  return <input ref={ref} className={`${inputClass} h-9 ${className}`} {...rest} />;
});

export const Select = forwardRef<HTMLSelectElement, SelectHTMLAttributes<HTMLSelectElement>>(function Select({ className = '', ...rest }, ref) {
  return <select ref={ref} className={`${inputClass} h-9 pr-8 ${className}`} {...rest} />;
});

export const Textarea = forwardRef<HTMLTextAreaElement, TextareaHTMLAttributes<HTMLTextAreaElement>>(function Textarea({ className = '', ...rest }, ref) {
  return <textarea ref={ref} className={`${inputClass} py-2 ${className}`} {...rest} />;
});

/** The <option>s of one of the contracts' labelled value lists (domain.ts): value → label. */
export function LabelledOptions<T extends string>({ list }: { list: { values: readonly T[]; labels: Record<T, string> } }) {
  return (
    <>
      {list.values.map((v) => (
        <option key={v} value={v}>
          {list.labels[v]}
        </option>
      ))}
    </>
  );
}

/** The message for a form as a whole (a server error that names no field on it). */
export function FormError({ message, className = '' }: { message: string | null | undefined; className?: string }) {
  if (!message) return null;
  return (
    <p role="alert" className={`rounded-md border border-brick-100 bg-brick-50 px-3 py-2 text-sm text-brick-800 ${className}`}>
      {message}
    </p>
  );
}

/** A short error under a control or a group of controls (a field's own error, a choice left out). */
export function InlineError({ message, id }: { message: string | null | undefined | false; id?: string }) {
  if (!message) return null;
  return (
    <p id={id} className="text-sm text-brick-700" role="alert">
      {message}
    </p>
  );
}
