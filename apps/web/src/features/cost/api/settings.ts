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
