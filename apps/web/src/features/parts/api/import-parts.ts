import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ImportPartsBody, ImportPartsResponse } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';
import { teardownScope } from '@/lib/query-keys';

/** Preview (dryRun) or commit a CSV import. A commit with a bad row is refused whole (ApiError 400). */
export const importParts = ({ teardownId, body, dryRun }: { teardownId: number; body: ImportPartsBody; dryRun: boolean }) =>
  withUnpublishConfirm((opts) => api.post<ImportPartsResponse>(`/api/teardowns/${teardownId}/parts/import`, body, { query: { dryRun: dryRun ? 1 : undefined }, ...opts }));

export function usePreviewPartsImport() {
  return useMutation({ mutationFn: (args: Omit<Parameters<typeof importParts>[0], 'dryRun'>) => importParts({ ...args, dryRun: true }) });
}

export function useCommitPartsImport(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (args: Omit<Parameters<typeof importParts>[0], 'dryRun'>) => importParts({ ...args, dryRun: false }),
    onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }),
  });
}
