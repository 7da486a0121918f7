import { CircleCheck, PencilLine } from 'lucide-react';
import { LINEUP_STATUS, type LineupStatus } from '@splitcase/contracts';
import { Badge } from '@/components/badges';

/** Lineup status with an icon and a label (never colour alone). */
export function LineupStatusBadge({ status }: { status: LineupStatus }) {
  return (
    <Badge tone={status === 'published' ? 'cell' : 'neutral'} icon={status === 'published' ? CircleCheck : PencilLine}>
      {LINEUP_STATUS.labels[status]}
    </Badge>
  );
}
