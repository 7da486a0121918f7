import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SuggestionDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';

export const reopenSuggestion = (teardownId: number, key: string) =>
  withUnpublishConfirm((opts) => api.post<{ suggestion: SuggestionDto }>(`/api/teardowns/${teardownId}/suggestions/${encodeURIComponent(key)}/reopen`, undefined, opts)).then((r) => r.suggestion);

export function useReopenSuggestion(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: (key: string) => reopenSuggestion(teardownId, key), onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
