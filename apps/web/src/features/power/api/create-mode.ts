import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateModeBody, ModeDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export const createMode = ({ teardownId, body, headers }: { teardownId: number; body: CreateModeBody; headers?: Record<string, string> }) =>
  api.post<{ mode: ModeDto }>(`/api/teardowns/${teardownId}/modes`, body, { headers }).then((r) => r.mode);

export function useCreateMode(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createMode, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
