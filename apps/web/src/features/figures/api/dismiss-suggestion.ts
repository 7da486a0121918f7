import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SuggestionDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';

export const dismissSuggestion = (teardownId: number, key: string) =>
  withUnpublishConfirm((opts) => api.post<{ suggestion: SuggestionDto }>(`/api/teardowns/${teardownId}/suggestions/${encodeURIComponent(key)}/dismiss`, undefined, opts)).then((r) => r.suggestion);

export function useDismissSuggestion(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: (key: string) => dismissSuggestion(teardownId, key), onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
