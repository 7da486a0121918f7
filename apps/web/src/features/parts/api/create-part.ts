import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreatePartBody, PartDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export const createPart = ({ teardownId, body, headers }: { teardownId: number; body: CreatePartBody; headers?: Record<string, string> }) =>
  api.post<{ part: PartDto }>(`/api/teardowns/${teardownId}/parts`, body, { headers }).then((r) => r.part);

export function useCreatePart(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createPart, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
