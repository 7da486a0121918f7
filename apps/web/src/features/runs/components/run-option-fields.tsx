import type { UseFormRegisterReturn } from 'react-hook-form';
import { RUN_KIND_NEEDS, RUN_OPTION_LABELS, SURFACE_MATERIAL, type RunKind, type RunOptionKey, type RunOptions, type RunOptionsFormValues } from '@splitcase/contracts';
import { Field, Input, LabelledOptions, Select } from '@/components/field';
import { useSettings } from '@/lib/settings';

/** What the charge termination field means. */
const TERMINATION_HINT = "C of the pack's rated capacity: 0.05 C is C/20 (blank), 0.1 C is C/10. Without a pack record, the share of the constant current.";

/** The workspace debounce as a field shows it ("5 s"), while the setting loads a plain word. */
const debounceDefaultText = (seconds: number | undefined) => (seconds === undefined ? 'setting' : `setting (${seconds} s)`);

/** How each option is typed; the labels and which kind reads which option come from contracts. */
const INPUTS: Record<Exclude<RunOptionKey, 'material'>, { inputMode: 'decimal' | 'numeric'; hint: string; placeholder?: string }> = {
  cutoffVolts: { inputMode: 'decimal', hint: "The cell maker's end voltage; Li-ion usually 2.5–3.0 V. Blank: until the load stops." },
  cutoffDebounceSeconds: { inputMode: 'decimal', hint: '' },
  cvVolts: { inputMode: 'decimal', hint: 'Blank: estimated from the top of the log', placeholder: 'e.g. 4.2' },
  terminationFraction: { inputMode: 'decimal', hint: TERMINATION_HINT, placeholder: '0.05' },
  contactSeconds: { inputMode: 'numeric', hint: "Blank: the teardown's, else the workspace's", placeholder: 'e.g. 600' },
  thresholdC: { inputMode: 'decimal', hint: 'Optional: when the surface first reaches it', placeholder: 'e.g. 45' },
  cellEnergyWh: { inputMode: 'decimal', hint: 'Blank: from the pack record, else the label' },
};

/**
 * The analysis settings of one kind of run (contracts' RUN_KIND_NEEDS), for the upload and the run's
 * settings form alike: `field` registers an option with the form, `errorOf` reads its message.
 */
export function RunOptionFields({ kind, field, errorOf }: { kind: RunKind; field: (key: RunOptionKey) => UseFormRegisterReturn; errorOf: (key: RunOptionKey) => string | undefined }) {
  const workspaceDebounce = useSettings().data?.cutoffDebounceSeconds;
  return (
    <>
      {RUN_KIND_NEEDS[kind].options.map((key: RunOptionKey) => {
        const label = RUN_OPTION_LABELS[key];
        if (key === 'material') {
          return (
            <Field key={key} label={label} error={errorOf(key)} hint="Blank: the heater record, else metal">
              {(f) => (
                <Select {...f} {...field(key)}>
                  <option value="">Not given</option>
                  <LabelledOptions list={SURFACE_MATERIAL} />
                </Select>
              )}
            </Field>
          );
        }
        const input = INPUTS[key];
        const debounce = key === 'cutoffDebounceSeconds';
        const hint = debounce
          ? `How long the voltage must stay at or under the cut-off; shorter sags at a load step are ignored. Blank: the workspace ${debounceDefaultText(workspaceDebounce)}; 0: the first sample at the cut-off.`
          : input.hint;
        const placeholder = debounce ? (workspaceDebounce === undefined ? '' : String(workspaceDebounce)) : input.placeholder;
        return (
          <Field key={key} label={label} error={errorOf(key)} hint={hint}>
            {(f) => <Input {...f} inputMode={input.inputMode} placeholder={placeholder} {...field(key)} />}
          </Field>
        );
      })}
    </>
  );
}

/** The options of a run as its settings form shows them (blank = not set). */
export function optionTexts(kind: RunKind, options: RunOptions): RunOptionsFormValues {
  return Object.fromEntries(RUN_KIND_NEEDS[kind].options.map((k: RunOptionKey) => [k, options[k] === null || options[k] === undefined ? '' : String(options[k])])) as RunOptionsFormValues;
}
