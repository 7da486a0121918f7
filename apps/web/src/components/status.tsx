import { CircleCheck, Eye, PencilLine, OctagonAlert, TriangleAlert, Info, CircleDot } from 'lucide-react';
import { SEVERITY, TEARDOWN_STATUS, type Severity, type TeardownStatus } from '@splitcase/contracts';
import { Badge } from './badges';

/** Teardown status with an icon and a label (never colour alone). */
export function StatusBadge({ status }: { status: TeardownStatus }) {
  const icon = status === 'published' ? CircleCheck : status === 'in_review' ? Eye : PencilLine;
  const tone = status === 'published' ? 'cell' : status === 'in_review' ? 'amber' : 'neutral';
  return (
    <Badge tone={tone} icon={icon}>
      {TEARDOWN_STATUS.labels[status]}
    </Badge>
  );
}

export function SeverityBadge({ severity }: { severity: Severity }) {
  const icon = severity === 'critical' ? OctagonAlert : severity === 'major' ? TriangleAlert : severity === 'minor' ? CircleDot : Info;
  const tone = severity === 'critical' ? 'brick' : severity === 'major' ? 'amber' : severity === 'minor' ? 'copper' : 'neutral';
  return (
    <Badge tone={tone} icon={icon}>
      {SEVERITY.labels[severity]}
    </Badge>
  );
}
