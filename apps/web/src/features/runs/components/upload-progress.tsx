import { useEffect, useState } from 'react';
import { Button } from '@/components/button';
import type { UploadPhase } from '../api/upload-run';

function ProgressBar({ fraction, label }: { fraction: number | null; label: string }) {
  return (
    <div className="space-y-1">
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={fraction === null ? undefined : Math.round(fraction * 100)}
        className="h-2 overflow-hidden rounded-full bg-graphite-100"
      >
        {fraction === null ? (
          <div className="h-full w-1/3 animate-pulse rounded-full bg-copper-400" />
        ) : (
          <div className="h-full rounded-full bg-copper-500 transition-[width]" style={{ width: `${Math.round(fraction * 100)}%` }} />
        )}
      </div>
    </div>
  );
}

/** Seconds since a moment, ticking once a second (the server phase has no byte count to show). */
function useElapsed(since: number | null): number {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    if (since === null) return;
    const timer = setInterval(() => setNow(Date.now()), 1000);
    return () => clearInterval(timer);
  }, [since]);
  return since === null ? 0 : Math.max(0, Math.round((now - since) / 1000));
}

/** The two phases of an upload: the bytes sent (cancellable), then parsing and analysing on the server. */
export function UploadProgress({ phase, fileName, onCancel }: { phase: Extract<UploadPhase, { step: 'uploading' | 'analysing' }>; fileName: string; onCancel: () => void }) {
  const elapsed = useElapsed(phase.step === 'analysing' ? phase.since : null);
  return (
    <div className="space-y-2 rounded-md border border-graphite-100 p-3" aria-live="polite">
      {phase.step === 'uploading' ? (
        <>
          <div className="flex justify-between text-sm">
            <span>1 of 2 · Uploading {fileName}</span>
            <span className="num">{Math.round(phase.fraction * 100)} %</span>
          </div>
          <ProgressBar fraction={phase.fraction} label="Upload" />
          <Button size="sm" variant="ghost" onClick={onCancel}>
            Cancel the upload
          </Button>
        </>
      ) : (
        <>
          <div className="flex justify-between text-sm">
            <span>2 of 2 · Parsing and analysing on the server</span>
            <span className="num">{elapsed} s</span>
          </div>
          <ProgressBar fraction={null} label="Analysis" />
          <p className="text-xs text-graphite-500">The whole file is read and checked row by row; a million rows take a few seconds.</p>
        </>
      )}
    </div>
  );
}
