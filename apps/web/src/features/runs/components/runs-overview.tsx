import { useState } from 'react';
import { Link } from 'react-router';
import { Layers } from 'lucide-react';
import type { RunDto } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { Card, EmptyState } from '@/components/page';
import { ChartsPanel } from './runs-section';
import { MAX_OVERLAY, RunPicker } from './run-picker';

/** Cross-device overlay: pick up to four runs from any teardown the user can open and plot them together. */
export function RunsOverview({ teardownLink }: { teardownLink: (run: RunDto) => string }) {
  const [selected, setSelected] = useState<RunDto[]>([]);
  return (
    <div className="space-y-5">
      <Card title={`Runs to overlay (up to ${MAX_OVERLAY})`}>
        <div className="p-4">
          <RunPicker kind="discharge" fixed={[]} selected={selected} onChange={setSelected} />
        </div>
      </Card>
      <Card
        title="Overlay"
        actions={
          selected.length > 0 ? (
            <Button size="sm" variant="ghost" onClick={() => setSelected([])}>
              Clear
            </Button>
          ) : undefined
        }
      >
        {selected.length === 0 ? (
          <EmptyState icon={<Layers className="size-8" />} message="Tick up to four runs above — the same test on several devices, say — to plot them on one time axis." />
        ) : (
          <div className="space-y-3 p-4">
            <ul className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-graphite-600">
              {selected.map((r) => (
                <li key={r.id}>
                  <Link className="text-copper-700 hover:underline" to={teardownLink(r)}>
                    {r.device.maker} {r.device.model}: {r.label}
                  </Link>
                </li>
              ))}
            </ul>
            <ChartsPanel runs={selected} />
          </div>
        )}
      </Card>
    </div>
  );
}
