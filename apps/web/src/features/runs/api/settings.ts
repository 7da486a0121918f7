import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { UpdateSettingsBody, WorkspaceSettings } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { settingsKey } from '@/lib/query-keys';
import { runsKey } from './all-runs';

export const getSettings = () => api.get<{ settings: WorkspaceSettings }>('/api/settings').then((r) => r.settings);
export const settingsQuery = () => queryOptions({ queryKey: settingsKey, queryFn: getSettings, staleTime: 60_000 });
export const useSettings = () => useQuery(settingsQuery());

export const updateSettings = (body: UpdateSettingsBody) => api.patch<{ settings: WorkspaceSettings }>('/api/settings', body).then((r) => r.settings);

/** Changing the threshold changes every comparison: refresh teardowns and runs. */
export function useUpdateSettings() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: updateSettings,
    onSuccess: (settings) => {
      qc.setQueryData(settingsKey, settings);
      return Promise.all([qc.invalidateQueries({ queryKey: ['teardowns'] }), qc.invalidateQueries({ queryKey: runsKey })]);
    },
  });
}
