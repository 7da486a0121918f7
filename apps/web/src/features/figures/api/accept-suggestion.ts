import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { FindingDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';

export const acceptSuggestion = (teardownId: number, key: string) =>
  withUnpublishConfirm((opts) => api.post<{ finding: FindingDto }>(`/api/teardowns/${teardownId}/suggestions/${encodeURIComponent(key)}/accept`, undefined, opts)).then((r) => r.finding);

export function useAcceptSuggestion(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: (key: string) => acceptSuggestion(teardownId, key), onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
