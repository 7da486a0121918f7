import { ESTIMATES_NOTE, HOT_SURFACE_CAUTION, type TeardownDto } from '@splitcase/contracts';
import { EstimatesNote, HotSurfaceNote, LithiumCaution } from '@/components/safety';

/**
 * The cautions that apply to this device, in the words of contracts/cautions.ts: the engineer's own
 * safety notes, lithium cells (or cells not identified yet), hot surfaces when it heats, and the
 * nature of the figures.
 */
export function ReportSafety({ teardown, hot }: { teardown: TeardownDto; hot: boolean }) {
  return (
    <div className="space-y-2.5">
      {teardown.safetyNotes && (
        <div className="break-inside-avoid">
          <p className="text-2xs font-semibold uppercase tracking-wide text-graphite-500">Notes from the bench</p>
          <p className="whitespace-pre-line text-sm text-graphite-950">{teardown.safetyNotes}</p>
        </div>
      )}
      <div className="break-inside-avoid">
        <LithiumCaution cell={teardown.cell} />
      </div>
      {hot && (
        <div className="break-inside-avoid">
          <HotSurfaceNote text={HOT_SURFACE_CAUTION} />
        </div>
      )}
      <div className="break-inside-avoid">
        <EstimatesNote text={ESTIMATES_NOTE} />
      </div>
    </div>
  );
}
