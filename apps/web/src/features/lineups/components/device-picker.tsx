import { useMemo, useState } from 'react';
import { ArrowDown, ArrowUp, Search, X } from 'lucide-react';
import { DEVICE_CATEGORY, type DeviceDto } from '@splitcase/contracts';
import { StatusBadge } from '@/components/status';
import { inputClass } from '@/components/field';
import { formatMoney } from '@/lib/format';

/**
 * Pick the devices of a lineup from the devices list: search by maker, model or category, tick
 * to add; the picked devices keep the order they were added in (move them up or down).
 */
export function DevicePicker({
  devices,
  value,
  onChange,
  error,
  itemErrors = {},
}: {
  devices: DeviceDto[];
  value: number[];
  onChange: (ids: number[]) => void;
  error?: string | undefined;
  /** Messages for single picks, by position (the server's `deviceIds.<k>`). */
  itemErrors?: Record<number, string>;
}) {
  const [q, setQ] = useState('');
  const byId = useMemo(() => new Map(devices.map((d) => [d.id, d])), [devices]);
  const shown = useMemo(() => {
    const words = q.trim().toLowerCase().split(/\s+/).filter(Boolean);
    return devices.filter((d) => {
      const text = `${d.maker} ${d.model} ${DEVICE_CATEGORY.labels[d.category]}`.toLowerCase();
      return words.every((w) => text.includes(w));
    });
  }, [devices, q]);
  const picked = new Set(value);
  const toggle = (id: number) => onChange(picked.has(id) ? value.filter((x) => x !== id) : [...value, id]);
  const move = (k: number, by: -1 | 1) => {
    const next = [...value];
    const [item] = next.splice(k, 1);
    next.splice(k + by, 0, item!);
    onChange(next);
  };

  return (
    <div className="grid gap-4 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
      <div className="min-w-0">
        <label className="relative block">
          <span className="sr-only">Search devices</span>
          <Search className="pointer-events-none absolute left-2.5 top-2.5 size-4 text-graphite-400" aria-hidden />
          <input type="search" value={q} onChange={(e) => setQ(e.target.value)} placeholder="Search maker, model or category" aria-label="Search devices" className={`${inputClass} h-9 pl-8`} />
        </label>
        <ul className="mt-2 max-h-80 divide-y divide-graphite-100 overflow-auto rounded-md border border-graphite-150 bg-white" aria-label="Devices to pick from">
          {shown.length === 0 && <li className="p-4 text-sm text-graphite-500">No device matches “{q}”.</li>}
          {shown.map((d) => (
            <li key={d.id}>
              <label className="flex min-h-10 cursor-pointer items-center gap-3 px-3 py-1.5 text-sm hover:bg-copper-50/60">
                <input type="checkbox" checked={picked.has(d.id)} onChange={() => toggle(d.id)} className="size-4 accent-copper-600" aria-label={`${d.maker} ${d.model}`} />
                <span className="min-w-0 flex-1">
                  <span className="font-medium text-graphite-950">{d.maker}</span> {d.model}
                  <span className="block text-xs text-graphite-500">
                    {DEVICE_CATEGORY.labels[d.category]}
                    {d.retailPrice !== null && d.currency ? ` · ${formatMoney(d.retailPrice, d.currency, 2)}` : ' · no retail price'}
                  </span>
                </span>
                {d.latestTeardown ? <StatusBadge status={d.latestTeardown.status} /> : <span className="text-xs text-graphite-500">No teardown</span>}
              </label>
            </li>
          ))}
        </ul>
      </div>
      <div className="min-w-0">
        <p className="text-sm font-medium text-graphite-800">
          In the lineup <span className="num text-graphite-500">({value.length})</span>
        </p>
        {value.length === 0 ? (
          <p className="mt-2 rounded-md border border-dashed border-graphite-200 p-4 text-sm text-graphite-500">Tick at least two devices to compare.</p>
        ) : (
          <ol className="mt-2 space-y-1" aria-label="Devices in the lineup">
            {value.map((id, k) => {
              const d = byId.get(id);
              const name = d ? `${d.maker} ${d.model}` : `Device ${id}`;
              return (
                <li key={id} className="rounded-md border border-graphite-150 bg-white px-2 py-1 text-sm">
                  <div className="flex items-center gap-2">
                    <span className="num w-5 text-right text-xs text-graphite-500">{k + 1}</span>
                    <span className="min-w-0 flex-1 truncate">{name}</span>
                    <button
                      type="button"
                      className="rounded p-1 text-graphite-500 hover:bg-graphite-100 disabled:opacity-30"
                      onClick={() => move(k, -1)}
                      disabled={k === 0}
                      aria-label={`Move ${name} up`}
                    >
                      <ArrowUp className="size-3.5" aria-hidden />
                    </button>
                    <button
                      type="button"
                      className="rounded p-1 text-graphite-500 hover:bg-graphite-100 disabled:opacity-30"
                      onClick={() => move(k, 1)}
                      disabled={k === value.length - 1}
                      aria-label={`Move ${name} down`}
                    >
                      <ArrowDown className="size-3.5" aria-hidden />
                    </button>
                    <button type="button" className="rounded p-1 text-graphite-500 hover:bg-brick-50 hover:text-brick-700" onClick={() => toggle(id)} aria-label={`Take ${name} out`}>
                      <X className="size-3.5" aria-hidden />
                    </button>
                  </div>
                  {itemErrors[k] && (
                    <p className="pl-7 text-xs text-brick-700" role="alert">
                      {itemErrors[k]}
                    </p>
                  )}
                </li>
              );
            })}
          </ol>
        )}
        {error && (
          <p className="mt-2 text-sm text-brick-700" role="alert">
            {error}
          </p>
        )}
      </div>
    </div>
  );
}
