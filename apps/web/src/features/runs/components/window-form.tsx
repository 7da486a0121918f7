import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { seriesWindowFormSchema, type SeriesWindowForm, type SeriesWindowFormValues } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { Input } from '@/components/field';
import type { SeriesWindow } from '../api/run-series';
import { timeAxisUnit } from './time-format';

/** A window of the chart typed as a start and an end in the time axis's unit. */
export function WindowForm({ domain, onZoom }: { domain: [number, number]; onZoom: (w: SeriesWindow) => void }) {
  const axis = timeAxisUnit(domain[1] - domain[0]);
  const { register, handleSubmit, formState } = useForm<SeriesWindowFormValues, unknown, SeriesWindowForm>({
    resolver: zodResolver(seriesWindowFormSchema),
    defaultValues: { from: '', to: '' },
  });
  const error = formState.errors.to?.message ?? formState.errors.from?.message;
  return (
    <form className="flex flex-wrap items-end gap-2 text-xs" noValidate onSubmit={handleSubmit((w) => onZoom({ from: w.from * axis.divisor, to: w.to * axis.divisor }))}>
      <label className="w-24 space-y-0.5">
        <span className="block text-graphite-500">From ({axis.unit})</span>
        <Input className="h-8" inputMode="decimal" aria-invalid={Boolean(error)} {...register('from')} />
      </label>
      <label className="w-24 space-y-0.5">
        <span className="block text-graphite-500">To ({axis.unit})</span>
        <Input className="h-8" inputMode="decimal" aria-invalid={Boolean(error)} {...register('to')} />
      </label>
      <Button type="submit" size="sm">
        Show window
      </Button>
      {error && (
        <span role="alert" className="text-brick-700">
          {error}, in {axis.unit}.
        </span>
      )}
    </form>
  );
}
