import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ManualRatesBody, RateTableResponse } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';

export const saveRates = (body: ManualRatesBody) => api.put<RateTableResponse>('/api/rates', body);

/** A new rate table changes every converted figure: rates and every teardown's roll-up are read again. */
export function useSaveRates() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: saveRates,
    onSuccess: () => Promise.all([qc.invalidateQueries({ queryKey: rootKeys.rates }), qc.invalidateQueries({ queryKey: rootKeys.teardowns })]),
  });
}
