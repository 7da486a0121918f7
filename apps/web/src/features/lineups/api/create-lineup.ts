import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateLineupBody, LineupDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';

export const createLineup = (body: CreateLineupBody) => api.post<{ lineup: LineupDto }>('/api/lineups', body).then((r) => r.lineup);

export function useCreateLineup() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createLineup, onSuccess: () => qc.invalidateQueries({ queryKey: rootKeys.lineups }) });
}
