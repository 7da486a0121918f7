import { FINDING_KIND, type FindingDto, type PhotoDto, type Severity } from '@splitcase/contracts';
import { SeverityBadge } from '@/components/status';
import { NoneRecorded } from './report-layout';
import { photoNumber } from './report-photos';

const ORDER: Severity[] = ['critical', 'major', 'minor', 'note'];

/** Findings grouped by severity, most severe first, with the parts they concern and the pins that mark them. */
export function ReportFindings({ findings, photos }: { findings: FindingDto[]; photos: PhotoDto[] }) {
  if (!findings.length) return <NoneRecorded>No findings recorded.</NoneRecorded>;
  const pinsOf = (findingId: number) => photos.flatMap((p) => p.callouts.filter((c) => c.finding?.id === findingId).map((c) => `pin ${c.number} on photo ${photoNumber(photos, p.id)}`));
  return (
    <div className="space-y-4">
      {ORDER.map((severity) => {
        const group = findings.filter((f) => f.severity === severity);
        if (!group.length) return null;
        return (
          <div key={severity} data-severity={severity}>
            <h3 className="mb-1.5 flex items-center gap-2 text-xs font-semibold uppercase tracking-wider text-graphite-600 break-after-avoid">
              <SeverityBadge severity={severity} />
              <span className="num">
                {group.length} finding{group.length === 1 ? '' : 's'}
              </span>
            </h3>
            <ol className="divide-y divide-graphite-150 border-y border-graphite-150">
              {group.map((f) => {
                const pins = pinsOf(f.id);
                return (
                  <li key={f.id} className="break-inside-avoid py-1.5 text-sm" data-finding={f.id}>
                    <p className="text-2xs font-semibold uppercase tracking-wide text-graphite-500">
                      {FINDING_KIND.labels[f.kind]}
                      {f.tags.length > 0 && <span className="font-normal normal-case tracking-normal"> · {f.tags.join(', ')}</span>}
                    </p>
                    <p className="text-graphite-950">{f.text}</p>
                    {(f.parts.length > 0 || pins.length > 0) && (
                      <p className="mt-0.5 text-2xs text-graphite-500">
                        {f.parts.length > 0 && <>Parts: {f.parts.map((p) => (p.designators ? `${p.designators} (${p.description})` : p.description)).join('; ')}</>}
                        {f.parts.length > 0 && pins.length > 0 && ' · '}
                        {pins.length > 0 && <>Marked by {pins.join(', ')}</>}
                      </p>
                    )}
                  </li>
                );
              })}
            </ol>
          </div>
        );
      })}
    </div>
  );
}
