import { useCallback, useRef, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { RunDto, RunMapping, RunOptions } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys, teardownScope } from '@/lib/query-keys';

/** Where an upload is: sending the file (with the fraction sent), then parsing and analysing on the server. */
export type UploadPhase = { step: 'idle' } | { step: 'uploading'; fraction: number } | { step: 'analysing'; since: number } | { step: 'done'; run: RunDto };

export interface UploadRunInput {
  teardownId: number;
  file: File;
  mapping: RunMapping;
  label?: string | undefined;
  options?: RunOptions | undefined;
  /** From `confirmUnpublishFirst`: the confirm header when the teardown is published and the person said yes. */
  headers?: Record<string, string> | undefined;
}

/** Upload with progress; after the last byte the server parses and analyses, shown as its own phase. */
export function useUploadRun() {
  const qc = useQueryClient();
  const [phase, setPhase] = useState<UploadPhase>({ step: 'idle' });
  const abortRef = useRef<(() => void) | null>(null);

  const start = useCallback(
    async (input: UploadRunInput): Promise<RunDto> => {
      const form = new FormData();
      form.append('mapping', JSON.stringify(input.mapping));
      if (input.label) form.append('label', input.label);
      if (input.options && Object.keys(input.options).length) form.append('options', JSON.stringify(input.options));
      form.append('file', input.file, input.file.name);
      setPhase({ step: 'uploading', fraction: 0 });
      const { promise, abort } = api.upload<{ run: RunDto }>(
        `/api/teardowns/${input.teardownId}/runs`,
        form,
        (fraction) => setPhase(fraction >= 1 ? { step: 'analysing', since: Date.now() } : { step: 'uploading', fraction }),
        input.headers ?? {},
      );
      abortRef.current = abort;
      try {
        const { run } = await promise;
        setPhase({ step: 'done', run });
        await Promise.all([qc.invalidateQueries({ queryKey: teardownScope(input.teardownId) }), qc.invalidateQueries({ queryKey: rootKeys.runs })]);
        return run;
      } catch (err) {
        setPhase({ step: 'idle' });
        throw err;
      } finally {
        abortRef.current = null;
      }
    },
    [qc],
  );

  const cancel = useCallback(() => abortRef.current?.(), []);
  const reset = useCallback(() => setPhase({ step: 'idle' }), []);
  return { phase, start, cancel, reset };
}
