import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';
import { lineupScope } from './keys';

export const deleteLineup = (id: number) => api.delete<void>(`/api/lineups/${id}`);

export function useDeleteLineup() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: deleteLineup,
    onSuccess: (_v, id) => {
      qc.removeQueries({ queryKey: lineupScope(id) });
      return qc.invalidateQueries({ queryKey: rootKeys.lineups });
    },
  });
}
