import { useState } from 'react';
import { bareHint, HEATER_TOOL_FIELDS, TRACE_LAYERS, TRACE_LAYER_LABELS, type HeaterTraceToolBody } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { Caution } from '@/components/caution';
import { InlineError } from '@/components/field';
import { useDebouncedValue } from '@/lib/use-debounced-value';
import { useHeaterTrace } from '../api/heater-trace';
import { FigureCard } from './figure-card';
import { QuantityField } from './quantity-field';
import { Segmented } from './segmented';
import { ResultsState, ToolLayout } from './tool-layout';
import { filledFields, useToolResult } from './use-tool-result';

type Layer = (typeof TRACE_LAYERS)[number];
type TextFields = 'length' | 'width' | 'thickness' | 'temperature' | 'supplyVoltage' | 'current' | 'temperatureRise' | 'area';

const EMPTY: Record<TextFields, string> = {
  length: '',
  width: '',
  thickness: '',
  temperature: '',
  supplyVoltage: '',
  current: '',
  temperatureRise: '',
  area: '',
};

/** A pocket-heater trace to start from: about 3 Ω of 10 mil, 1 oz copper across one cell, over a 40 × 60 mm pad. */
const EXAMPLE: Record<TextFields, string> = {
  length: '1547 mm',
  width: '10 mil',
  thickness: '1 oz',
  temperature: '',
  supplyVoltage: '3.65 V',
  current: '',
  temperatureRise: '10 °C',
  area: '24 cm²',
};

/** What each field is for; label, placeholder and the bare-number rule come from contracts' HEATER_TOOL_FIELDS. */
const HINT: Record<TextFields, string> = {
  length: 'Along the trace, end to end',
  width: 'mm, µm or mil',
  thickness: 'A thickness, or a copper weight in oz/ft² (1 oz = 35 µm)',
  temperature: 'For the resistance; 20 °C if blank',
  supplyVoltage: 'Across the trace, for power and current',
  current: 'Optional: the design current, if not the supply’s',
  temperatureRise: '10 °C if blank',
  area: 'For power density and the surface estimate',
};
const FIELDS = (Object.keys(HINT) as TextFields[]).map((name) => {
  const f = HEATER_TOOL_FIELDS[name];
  return { name, label: f.label, placeholder: f.placeholder, hint: `${HINT[name]} · ${bareHint(f)}.` };
});

/** Heater-trace calculator: resistance, power, IPC-2221 rating and width, power density. */
export function HeaterTracePanel() {
  const [fields, setFields] = useState(EMPTY);
  const [layer, setLayer] = useState<Layer>('external');
  const filled = filledFields(fields);
  const body: HeaterTraceToolBody | null = filled.length && filled.width && filled.thickness ? { ...filled, length: filled.length, width: filled.width, thickness: filled.thickness, layer } : null;
  const debounced = useDebouncedValue(body, 400);
  const state = useToolResult(useHeaterTrace(debounced), debounced !== null);
  const figures = state.result?.figures ?? [];
  const set = (name: TextFields) => (value: string) => setFields((f) => ({ ...f, [name]: value }));

  return (
    <ToolLayout
      title="Heater trace"
      actions={
        <div className="flex gap-1">
          <Button size="sm" variant="quiet" onClick={() => setFields(EXAMPLE)}>
            Example
          </Button>
          <Button size="sm" variant="ghost" onClick={() => setFields(EMPTY)}>
            Clear
          </Button>
        </div>
      }
      inputs={
        <>
          {FIELDS.slice(0, 3).map((f) => (
            <QuantityField key={f.name} {...f} value={fields[f.name]} onChange={set(f.name)} error={state.fieldErrors[f.name]} parsed={state.parsed[f.name]} />
          ))}
          <Segmented legend="Layer" value={layer} onChange={setLayer} options={TRACE_LAYERS.map((l) => ({ value: l, label: TRACE_LAYER_LABELS[l] }))} />
          <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-1 xl:grid-cols-2">
            {FIELDS.slice(3).map((f) => (
              <QuantityField key={f.name} {...f} value={fields[f.name]} onChange={set(f.name)} error={state.fieldErrors[f.name]} parsed={state.parsed[f.name]} />
            ))}
          </div>
          <InlineError message={state.fieldErrors.layer} />
        </>
      }
    >
      <ResultsState
        empty="Type the trace’s length, width and copper thickness, with units as you write them (100 mm, 10 mil, 1 oz). Add a supply voltage for power."
        hasResult={state.result !== undefined}
        outdated={state.outdated}
        busy={state.busy}
        message={state.message}
      >
        <div className="gap-4 md:columns-2 [&>*]:mb-4 [&>*]:break-inside-avoid">
          {figures.map((f) => (
            <FigureCard key={f.key} figure={f}>
              {f.key === 'powerDensity' && (
                <div className="mt-3">
                  <Caution title="Hot surfaces">
                    Skin burns with long contact at temperatures that only feel warm: about 43 °C over hours, 48–51 °C within minutes (ISO 13732-1). Measure a running heater with a thermocouple, not
                    by touch, keep it off flammable material and follow your lab’s safety rules.
                  </Caution>
                </div>
              )}
            </FigureCard>
          ))}
        </div>
      </ResultsState>
    </ToolLayout>
  );
}
