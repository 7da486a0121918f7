import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { UpdateSettingsBody, WorkspaceSettings } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { settingsKey } from '@/lib/query-keys';

export const getSettings = () => api.get<{ settings: WorkspaceSettings }>('/api/settings').then((r) => r.settings);
export const settingsQuery = () => queryOptions({ queryKey: settingsKey, queryFn: getSettings, staleTime: 60_000 });
export const useSettings = () => useQuery(settingsQuery());

export const updateSettings = (body: UpdateSettingsBody) => api.patch<{ settings: WorkspaceSettings }>('/api/settings', body).then((r) => r.settings);

/** Settings change figures everywhere (contact times, usable share, cut-off, warnings): teardowns, lineups and runs are read again. */
export function useUpdateSettings() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: updateSettings,
    onSuccess: (settings) => {
      qc.setQueryData(settingsKey, settings);
      return Promise.all([qc.invalidateQueries({ queryKey: ['teardowns'] }), qc.invalidateQueries({ queryKey: ['lineups'] }), qc.invalidateQueries({ queryKey: ['runs'] })]);
    },
  });
}
