import { useState } from 'react';
import { SURFACE_MATERIAL, type RunDto, type RunOptions } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { ErrorPanel } from '@/components/error-boundary';
import { Field, Input, Select } from '@/components/field';
import { ApiError } from '@/lib/api-client';
import { useSettings } from '@/lib/settings';
import { useUpdateRun } from '../api/update-run';
import { debounceDefaultText, TERMINATION_HINT } from './run-option-text';

const text = (x: number | null | undefined) => (x === null || x === undefined ? '' : String(x));
const numberOrNull = (s: string) => (s.trim() === '' ? null : Number(s.replace(',', '.')));

/** Label and analysis settings of a run; saving re-analyses the stored series on the server. */
export function RunEditForm({ run, onClose }: { run: RunDto; onClose: () => void }) {
  const update = useUpdateRun();
  const o = run.options;
  const [label, setLabel] = useState(run.label);
  const [cutoffVolts, setCutoff] = useState(text(o.cutoffVolts));
  const [debounce, setDebounce] = useState(text(o.cutoffDebounceSeconds));
  const [cvVolts, setCv] = useState(text(o.cvVolts));
  const [termination, setTermination] = useState(text(o.terminationFraction));
  const workspaceDebounce = useSettings().data?.cutoffDebounceSeconds;
  const [material, setMaterial] = useState<string>(o.material ?? '');
  const [contact, setContact] = useState(text(o.contactSeconds));
  const [threshold, setThreshold] = useState(text(o.thresholdC));
  const [cellEnergy, setCellEnergy] = useState(text(o.cellEnergyWh));
  const [confirming, setConfirming] = useState(false);
  const fields = update.error instanceof ApiError ? update.error.fields : {};

  const options = (): RunOptions => {
    if (run.kind === 'discharge') return { cutoffVolts: numberOrNull(cutoffVolts), cutoffDebounceSeconds: numberOrNull(debounce) };
    if (run.kind === 'charge') return { cvVolts: numberOrNull(cvVolts), terminationFraction: numberOrNull(termination) };
    if (run.kind === 'thermal') return { material: (material || null) as RunOptions['material'], contactSeconds: numberOrNull(contact), thresholdC: numberOrNull(threshold) };
    return { cellEnergyWh: numberOrNull(cellEnergy) };
  };

  const save = (confirmUnpublish = false) => {
    setConfirming(false);
    update.mutate(
      { run, body: { label, options: options() }, confirmUnpublish },
      {
        onSuccess: onClose,
        onError: (err) => {
          if (err instanceof ApiError && err.status === 409 && (err.details as { reason?: string } | undefined)?.reason === 'published') setConfirming(true);
        },
      },
    );
  };

  const other = update.error && !(update.error instanceof ApiError && (update.error.status === 409 || Object.keys(update.error.fields).length > 0));
  return (
    <form
      className="space-y-3 rounded-md border border-graphite-150 bg-graphite-50/60 p-3"
      onSubmit={(e) => {
        e.preventDefault();
        save();
      }}
    >
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
        <Field label="Label" error={fields.label}>
          {(f) => <Input {...f} value={label} maxLength={160} onChange={(e) => setLabel(e.target.value)} />}
        </Field>
        {run.kind === 'discharge' && (
          <>
            <Field label="Cut-off voltage (V)" error={fields['options.cutoffVolts']} hint="Blank: until the load stops">
              {(f) => <Input {...f} inputMode="decimal" value={cutoffVolts} onChange={(e) => setCutoff(e.target.value)} />}
            </Field>
            <Field label="Cut-off debounce (s)" error={fields['options.cutoffDebounceSeconds']} hint={`Blank: the workspace ${debounceDefaultText(workspaceDebounce)}; 0: the first sample at the cut-off`}>
              {(f) => <Input {...f} inputMode="decimal" value={debounce} onChange={(e) => setDebounce(e.target.value)} />}
            </Field>
          </>
        )}
        {run.kind === 'charge' && (
          <>
            <Field label="Charge voltage (V)" error={fields['options.cvVolts']} hint="Blank: estimated from the log">
              {(f) => <Input {...f} inputMode="decimal" value={cvVolts} onChange={(e) => setCv(e.target.value)} />}
            </Field>
            <Field label="Termination (C)" error={fields['options.terminationFraction']} hint={TERMINATION_HINT}>
              {(f) => <Input {...f} inputMode="decimal" value={termination} onChange={(e) => setTermination(e.target.value)} />}
            </Field>
          </>
        )}
        {run.kind === 'thermal' && (
          <>
            <Field label="Surface touched" error={fields['options.material']}>
              {(f) => (
                <Select {...f} value={material} onChange={(e) => setMaterial(e.target.value)}>
                  <option value="">Not given</option>
                  {SURFACE_MATERIAL.values.map((m) => (
                    <option key={m} value={m}>
                      {SURFACE_MATERIAL.labels[m]}
                    </option>
                  ))}
                </Select>
              )}
            </Field>
            <Field label="Contact time (s)" error={fields['options.contactSeconds']} hint="Blank: teardown or workspace default">
              {(f) => <Input {...f} inputMode="numeric" value={contact} onChange={(e) => setContact(e.target.value)} />}
            </Field>
            <Field label="Time to a temperature (°C)" error={fields['options.thresholdC']}>
              {(f) => <Input {...f} inputMode="decimal" value={threshold} onChange={(e) => setThreshold(e.target.value)} />}
            </Field>
          </>
        )}
        {run.kind === 'power-bank' && (
          <Field label="Cell energy (Wh)" error={fields['options.cellEnergyWh']} hint="Blank: pack record, else the label">
            {(f) => <Input {...f} inputMode="decimal" value={cellEnergy} onChange={(e) => setCellEnergy(e.target.value)} />}
          </Field>
        )}
      </div>
      {update.error instanceof ApiError && update.error.status === 422 && <p className="text-sm text-brick-700" role="alert">{update.error.message}</p>}
      {other && <ErrorPanel error={update.error} />}
      {confirming ? (
        <div role="alert" className="space-y-2 rounded-md border border-amber-100 bg-amber-50 p-3 text-sm text-amber-800">
          <p>This teardown is published. Changing the run moves it back to draft, and it will need review again.</p>
          <div className="flex gap-2">
            <Button size="sm" variant="primary" onClick={() => save(true)}>
              Save and move to draft
            </Button>
            <Button size="sm" onClick={() => setConfirming(false)}>
              Keep it published
            </Button>
          </div>
        </div>
      ) : (
        <div className="flex gap-2">
          <Button type="submit" variant="primary" size="sm" busy={update.isPending}>
            Save and re-analyse
          </Button>
          <Button size="sm" onClick={onClose}>
            Cancel
          </Button>
        </div>
      )}
    </form>
  );
}
