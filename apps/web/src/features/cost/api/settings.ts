import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { WorkspaceSettings } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { settingsKey } from '@/lib/query-keys';

export const getSettings = () => api.get<{ settings: WorkspaceSettings }>('/api/settings').then((r) => r.settings);
export const settingsQuery = () => queryOptions({ queryKey: settingsKey, queryFn: getSettings });
export const useSettings = () => useQuery(settingsQuery());

/** Sourcing and admin set the reporting currency; every roll-up that follows it is read again. */
export function useSetReportingCurrency() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (reportingCurrency: string) => api.patch<{ settings: WorkspaceSettings }>('/api/settings', { reportingCurrency }),
    onSuccess: (data) => {
      qc.setQueryData(settingsKey, data.settings);
      return qc.invalidateQueries({ queryKey: ['teardowns'] });
    },
  });
}

/** Sourcing and admin set the default sales tax in retail prices by currency; margins everywhere follow. */
export function useSetSalesTaxByCurrency() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (salesTaxByCurrency: Record<string, number>) => api.patch<{ settings: WorkspaceSettings }>('/api/settings', { salesTaxByCurrency }),
    onSuccess: (data) => {
      qc.setQueryData(settingsKey, data.settings);
      return Promise.all([qc.invalidateQueries({ queryKey: ['teardowns'] }), qc.invalidateQueries({ queryKey: ['lineups'] })]);
    },
  });
}
