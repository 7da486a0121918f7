import type { FieldErrors, UseFormRegister, UseFormSetValue } from 'react-hook-form';
import {
  CURRENT_UNIT,
  POWER_UNIT,
  RUN_DELIMITER,
  RUN_KIND,
  RUN_QUANTITIES,
  RUN_QUANTITY_LABELS,
  runNeedsText,
  TEMPERATURE_UNIT,
  TIME_UNIT,
  VOLTAGE_UNIT,
  type RunKind,
  type RunMappingFormValues,
  type RunQuantityName,
  type RunUploadFormValues,
} from '@splitcase/contracts';
import { Field, InlineError, Input, LabelledOptions, Select } from '@/components/field';

const UNIT_OPTIONS: Record<RunQuantityName, { values: readonly string[]; labels: Record<string, string> }> = {
  time: TIME_UNIT,
  voltage: VOLTAGE_UNIT,
  current: CURRENT_UNIT,
  power: POWER_UNIT,
  temperature: TEMPERATURE_UNIT,
};

/** The first unit of each quantity: what a column not guessed starts with. */
export const firstUnit = (q: RunQuantityName) => UNIT_OPTIONS[q].values[0]!;

/** Small error line under a control of the mapping grid. */
const CellError = ({ message }: { message: string | undefined }) =>
  message ? (
    <p className="mt-0.5 text-xs text-brick-700" role="alert">
      {message}
    </p>
  ) : null;

/**
 * Which column holds which quantity, in which unit (the kind's needs from contracts in the legend),
 * and how the file is laid out: delimiter, header row, decimal comma.
 */
export function ColumnMapping({
  kind,
  columns,
  mapping,
  register,
  setValue,
  errors,
  disabled,
}: {
  kind: RunKind;
  columns: readonly string[];
  mapping: RunMappingFormValues;
  register: UseFormRegister<RunUploadFormValues>;
  setValue: UseFormSetValue<RunUploadFormValues>;
  errors: FieldErrors<RunUploadFormValues>['mapping'];
  disabled: boolean;
}) {
  return (
    <>
      <fieldset className="space-y-2" disabled={disabled}>
        <legend className="text-sm font-medium text-graphite-800">
          Columns — a {RUN_KIND.labels[kind].toLowerCase()} run needs {runNeedsText(kind)}
        </legend>
        <div className="divide-y divide-graphite-100 rounded-md border border-graphite-150">
          {RUN_QUANTITIES.map((q) => {
            const colError = errors?.[q]?.column?.message;
            const unitError = errors?.[q]?.unit?.message;
            const columnId = `run-map-${q}-column`;
            return (
              <div key={q} className="grid grid-cols-[6.5rem_minmax(0,1fr)_minmax(0,12rem)] items-start gap-2 px-2 py-1.5">
                <label htmlFor={columnId} className="pt-2 text-sm font-medium text-graphite-800">
                  {RUN_QUANTITY_LABELS[q]}
                </label>
                <div>
                  <Select id={columnId} aria-invalid={Boolean(colError)} {...register(`mapping.${q}.column`)}>
                    <option value="">{q === 'time' ? 'Choose a column' : 'Not logged'}</option>
                    {columns.map((c) => (
                      <option key={c} value={c}>
                        {c}
                      </option>
                    ))}
                  </Select>
                  <CellError message={colError} />
                </div>
                <div>
                  <Select
                    id={`run-map-${q}-unit`}
                    aria-label={`${RUN_QUANTITY_LABELS[q]} unit`}
                    aria-invalid={Boolean(unitError)}
                    // Held by the form's values, not registered: a disabled control registered with the form would read as no value.
                    value={mapping[q].unit}
                    disabled={!mapping[q].column}
                    onChange={(e) => setValue(`mapping.${q}.unit`, e.target.value, { shouldDirty: true })}
                  >
                    <LabelledOptions list={UNIT_OPTIONS[q]} />
                  </Select>
                  <CellError message={unitError} />
                </div>
              </div>
            );
          })}
        </div>
      </fieldset>

      <div className="grid gap-3 sm:grid-cols-3">
        <Field label="Delimiter" error={errors?.delimiter?.message} hint="Detected from the file">
          {(f) => (
            <Select {...f} disabled={disabled} {...register('mapping.delimiter')}>
              <LabelledOptions list={RUN_DELIMITER} />
            </Select>
          )}
        </Field>
        <Field label="Header row" error={errors?.headerRow?.message} hint="Line that holds the column names">
          {(f) => <Input {...f} inputMode="numeric" disabled={disabled} {...register('mapping.headerRow')} />}
        </Field>
        <label className="flex items-center gap-2 self-center pt-4 text-sm">
          <input type="checkbox" disabled={disabled} className="size-4 accent-copper-600" {...register('mapping.decimalComma')} />
          Decimal comma (3,712)
        </label>
      </div>
      <InlineError message={errors?.decimalComma?.message} />
    </>
  );
}
