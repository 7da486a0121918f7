import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LineupDto, UpdateLineupInput } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';

export const updateLineup = ({ id, ...body }: UpdateLineupInput & { id: number }) => api.patch<{ lineup: LineupDto }>(`/api/lineups/${id}`, body).then((r) => r.lineup);

/** Any change: the list, the lineup and its comparison are read again. */
export function useUpdateLineup() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updateLineup, onSuccess: () => qc.invalidateQueries({ queryKey: rootKeys.lineups }) });
}
