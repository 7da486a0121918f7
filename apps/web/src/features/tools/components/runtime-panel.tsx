import { useState } from 'react';
import { bareHint, CHEMISTRY, RUNTIME_TOOL_FIELDS, type Chemistry, type RuntimeToolBody } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { Caution } from '@/components/caution';
import { Field, Select, InlineError } from '@/components/field';
import { useDebouncedValue } from '@/lib/use-debounced-value';
import { useRuntime } from '../api/runtime';
import { FigureCard } from './figure-card';
import { QuantityField } from './quantity-field';
import { Segmented } from './segmented';
import { ResultsState, ToolLayout } from './tool-layout';
import { filledFields, useToolResult } from './use-tool-result';

type LoadMode = 'power' | 'resistance' | 'current';
type TextFields =
  'cellNominalVoltage' | 'cellCapacity' | 'series' | 'parallel' | 'loadPower' | 'loadResistance' | 'supplyVoltage' | 'loadCurrent' | 'efficiency' | 'usableFraction' | 'duty' | 'cellMass';

const EMPTY: Record<TextFields, string> = {
  cellNominalVoltage: '',
  cellCapacity: '',
  series: '',
  parallel: '',
  loadPower: '',
  loadResistance: '',
  supplyVoltage: '',
  loadCurrent: '',
  efficiency: '',
  usableFraction: '',
  duty: '',
  cellMass: '',
};

/** A pocket heater to start from: one 2700 mAh cell feeding two 3R0 elements in parallel. */
const EXAMPLE: Record<TextFields, string> = { ...EMPTY, cellNominalVoltage: '3.7 V', cellCapacity: '2700 mAh', loadResistance: '1R5', supplyVoltage: '3.65 V', cellMass: '46 g' };

const LOAD_FIELDS: Record<LoadMode, TextFields[]> = {
  power: ['loadPower'],
  resistance: ['loadResistance', 'supplyVoltage'],
  current: ['loadCurrent'],
};

/** What each field is for; label, placeholder and the bare-number rule come from contracts' RUNTIME_TOOL_FIELDS. */
const HINT: Record<TextFields, string> = {
  cellNominalVoltage: 'As on the cell label',
  cellCapacity: 'Rated, per cell',
  series: '1 if blank',
  parallel: '1 if blank',
  loadPower: 'While the load is on',
  loadResistance: 'Element or load, e.g. 3R0 or 1.5 Ω',
  supplyVoltage: 'The cell voltage if fed directly',
  loadCurrent: 'As measured at the pack',
  efficiency: '100 % (no converter) if blank',
  usableFraction: 'Share of the rated capacity used; 100 % if blank',
  duty: 'Share of time the load is on; 100 % if blank',
  cellMass: 'Optional: checks the label against the mass',
};
const INFO = Object.fromEntries(
  (Object.keys(HINT) as TextFields[]).map((k) => {
    const f = RUNTIME_TOOL_FIELDS[k];
    return [k, { label: f.label, placeholder: f.placeholder, hint: `${HINT[k]} · ${bareHint(f)}.` }];
  }),
) as Record<TextFields, { label: string; placeholder: string; hint: string }>;

const LITHIUM: readonly Chemistry[] = ['li-ion', 'li-po', 'lifepo4', 'lto'];

/** Runtime calculator: pack energy, runtime, C-rate, transport class, specific energy. */
export function RuntimePanel() {
  const [fields, setFields] = useState(EMPTY);
  const [loadMode, setLoadMode] = useState<LoadMode>('power');
  const [chemistry, setChemistry] = useState<Chemistry>('li-ion');
  const set = (name: TextFields) => (value: string) => setFields((f) => ({ ...f, [name]: value }));

  // Only the fields of the chosen load go to the server.
  const otherLoads: TextFields[] = [
    ...(Object.keys(LOAD_FIELDS) as LoadMode[]).filter((m) => m !== loadMode).flatMap((m) => LOAD_FIELDS[m]),
    ...(loadMode === 'current' ? (['efficiency'] as const) : []),
  ];
  const sent = Object.fromEntries(Object.entries(fields).filter(([k]) => !otherLoads.includes(k as TextFields))) as Record<TextFields, string>;
  const filled = filledFields(sent);
  const ready = filled.cellNominalVoltage && filled.cellCapacity && LOAD_FIELDS[loadMode].every((k) => filled[k]);
  const body: RuntimeToolBody | null = ready ? { ...filled, cellNominalVoltage: filled.cellNominalVoltage!, cellCapacity: filled.cellCapacity!, chemistry } : null;
  const debounced = useDebouncedValue(body, 400);
  const state = useToolResult(useRuntime(debounced), debounced !== null);
  // The runtime leads; the rest follow in the order the server derived them.
  const figures = [...(state.result?.figures ?? [])].sort((a, b) => Number(b.key === 'runtime') - Number(a.key === 'runtime'));

  const field = (name: TextFields) => <QuantityField key={name} name={name} {...INFO[name]} value={fields[name]} onChange={set(name)} error={state.fieldErrors[name]} parsed={state.parsed[name]} />;

  return (
    <ToolLayout
      title="Runtime"
      actions={
        <div className="flex gap-1">
          <Button
            size="sm"
            variant="quiet"
            onClick={() => {
              setFields(EXAMPLE);
              setLoadMode('resistance');
              setChemistry('li-ion');
            }}
          >
            Example
          </Button>
          <Button size="sm" variant="ghost" onClick={() => setFields(EMPTY)}>
            Clear
          </Button>
        </div>
      }
      inputs={
        <>
          <div className="grid grid-cols-2 gap-4">
            {field('cellNominalVoltage')}
            {field('cellCapacity')}
            {field('series')}
            {field('parallel')}
          </div>
          <Field label="Chemistry">
            {(props) => (
              <Select {...props} value={chemistry} onChange={(e) => setChemistry(e.target.value as Chemistry)} className="h-11 text-base">
                {CHEMISTRY.values.map((c) => (
                  <option key={c} value={c}>
                    {CHEMISTRY.labels[c]}
                  </option>
                ))}
              </Select>
            )}
          </Field>
          <Segmented
            legend="Load given as"
            value={loadMode}
            onChange={setLoadMode}
            options={[
              { value: 'power', label: 'Power' },
              { value: 'resistance', label: 'Resistance' },
              { value: 'current', label: 'Current' },
            ]}
          />
          <div className="grid grid-cols-2 gap-4">{LOAD_FIELDS[loadMode].map(field)}</div>
          <div className="grid grid-cols-2 gap-4">
            {loadMode !== 'current' && field('efficiency')}
            {field('duty')}
            {field('usableFraction')}
            {field('cellMass')}
          </div>
          <InlineError message={state.fieldErrors.chemistry} />
        </>
      }
    >
      <ResultsState
        empty="Type the cell’s voltage and capacity (2700 mAh works) and the load: its power, its resistance with the voltage across it, or the current it draws."
        hasResult={state.result !== undefined}
        outdated={state.outdated}
        busy={state.busy}
        message={state.message}
      >
        <div className="space-y-4">
          {LITHIUM.includes(chemistry) && (
            <Caution title="Lithium cells">
              Do not short, puncture, crush or open lithium cells: a damaged or swollen cell can vent and catch fire. Discharge packs before work, work on a non-flammable surface with a fire-safe
              container at hand, and follow your lab’s rules and local codes for charging, shipping and disposal.
            </Caution>
          )}
          <div className="gap-4 md:columns-2 [&>*]:mb-4 [&>*]:break-inside-avoid">
            {figures.map((f) => (
              <FigureCard key={f.key} figure={f} />
            ))}
          </div>
        </div>
      </ResultsState>
    </ToolLayout>
  );
}
