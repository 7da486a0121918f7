import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PriceImportResult } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export const importPrices = ({ teardownId, file, mode }: { teardownId: number; file: File; mode: 'preview' | 'apply' }) => {
  const form = new FormData();
  form.append('file', file);
  return api.postForm<PriceImportResult>(`/api/teardowns/${teardownId}/prices/import`, form, { query: { mode } });
};

/** preview saves nothing; apply saves every line or none, then the roll-up is read again. */
export function useImportPrices(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { file: File; mode: 'preview' | 'apply' }) => importPrices({ teardownId, ...v }),
    onSuccess: (result) => {
      if (result.mode === 'apply') return qc.invalidateQueries({ queryKey: teardownScope(teardownId) });
    },
  });
}
