import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PartPriceDto, SetPartPriceBody } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export const setPrice = ({ partId, ...body }: SetPartPriceBody & { partId: number }) => api.put<{ price: PartPriceDto }>(`/api/parts/${partId}/price`, body);

/** Saves a price; the roll-up of the teardown is read again from the server (no arithmetic here). */
export function useSetPrice(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: setPrice, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
