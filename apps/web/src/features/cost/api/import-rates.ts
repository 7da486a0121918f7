import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useState } from 'react';
import type { RateTableResponse } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';

/** Uploads the reference-rate XML file with progress; on success rates and roll-ups are read again. */
export function useImportRates() {
  const qc = useQueryClient();
  const [progress, setProgress] = useState<number | null>(null);
  const run = useCallback(
    async (file: File): Promise<RateTableResponse> => {
      const form = new FormData();
      form.append('file', file);
      setProgress(0);
      try {
        const result = await api.upload<RateTableResponse>('/api/rates/import', form, setProgress).promise;
        await Promise.all([qc.invalidateQueries({ queryKey: rootKeys.rates }), qc.invalidateQueries({ queryKey: rootKeys.teardowns })]);
        return result;
      } finally {
        setProgress(null);
      }
    },
    [qc],
  );
  return { run, progress, busy: progress !== null };
}
