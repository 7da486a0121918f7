import { useState, type ReactNode } from 'react';
import { Download, FileUp } from 'lucide-react';
import type { TeardownDto } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { ErrorPanel } from '@/components/error-boundary';
import { Card, Spinner } from '@/components/page';
import { PublishedEditNotice, useEditGate } from '@/components/published-edit';
import { partsCsvUrl, useParts } from '../api/parts';
import { ImportPanel } from './import-panel';
import { PartList } from './part-list';

/** The parts section of a teardown: the bill of materials, CSV import and export. */
export function PartsSection({ teardown, renderPartExtras }: { teardown: TeardownDto; renderPartExtras?: (partId: number) => ReactNode }) {
  const parts = useParts(teardown.id);
  const gate = useEditGate(teardown);
  const [importing, setImporting] = useState(false);

  if (parts.isPending) return <Spinner />;
  if (parts.isError) return <ErrorPanel error={parts.error} onRetry={() => parts.refetch()} />;
  const lines = parts.data;
  const pieces = lines.reduce((n, p) => n + p.quantity, 0);

  return (
    <div className="space-y-4">
      <PublishedEditNotice gate={gate} />
      {importing && gate.canEdit && <ImportPanel teardownId={teardown.id} onClose={() => setImporting(false)} />}
      <Card
        title={
          <span>
            Parts list{' '}
            <span className="ml-1 font-normal text-graphite-500">
              {lines.length} line{lines.length === 1 ? '' : 's'} · {pieces} piece{pieces === 1 ? '' : 's'}
            </span>
          </span>
        }
        actions={
          <div className="flex gap-2">
            {gate.canEdit && !importing && (
              <Button size="sm" onClick={() => setImporting(true)}>
                <FileUp className="size-4" aria-hidden /> Import CSV
              </Button>
            )}
            <a
              href={partsCsvUrl(teardown.id)}
              download
              className="inline-flex h-8 items-center gap-1.5 rounded-md bg-white px-2.5 text-sm font-medium text-graphite-900 ring-1 ring-inset ring-graphite-200 hover:bg-graphite-50"
            >
              <Download className="size-4" aria-hidden /> Export CSV
            </a>
          </div>
        }
      >
        <div className="p-2">
          <PartList teardownId={teardown.id} parts={lines} gate={gate} renderPartExtras={renderPartExtras} />
        </div>
        {gate.canEdit && <p className="px-4 pb-3 text-xs text-graphite-500">Click a line to edit it in place: Enter saves, Esc cancels. Markings of resistors (R…) and capacitors (C…) are decoded.</p>}
      </Card>
    </div>
  );
}
