import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { FindingDto, FindingFormValues } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';

export const updateFinding = (teardownId: number, findingId: number, body: Partial<FindingFormValues>) =>
  withUnpublishConfirm((opts) => api.patch<{ finding: FindingDto }>(`/api/teardowns/${teardownId}/findings/${findingId}`, body, opts)).then((r) => r.finding);

export function useUpdateFinding(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...body }: Partial<FindingFormValues> & { id: number }) => updateFinding(teardownId, id, body),
    onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }),
  });
}
