import type { TeardownDto } from '@splitcase/contracts';
import { Card } from '@/components/page';

export function OverviewSection({ teardown }: { teardown: TeardownDto }) {
  return (
    <Card title="Summary">
      <div className="space-y-3 p-4 text-sm">
        <p className="whitespace-pre-wrap">{teardown.summary ?? 'No summary yet.'}</p>
        {teardown.safetyNotes && <p className="whitespace-pre-wrap text-graphite-600">{teardown.safetyNotes}</p>}
      </div>
    </Card>
  );
}
