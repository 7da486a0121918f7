import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { FindingDto, FindingFormValues } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';

export const createFinding = (teardownId: number, body: FindingFormValues) =>
  withUnpublishConfirm((opts) => api.post<{ finding: FindingDto }>(`/api/teardowns/${teardownId}/findings`, body, opts)).then((r) => r.finding);

export function useCreateFinding(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: (body: FindingFormValues) => createFinding(teardownId, body), onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
