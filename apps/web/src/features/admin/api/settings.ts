import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { UpdateSettingsBody, WorkspaceSettings } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { settingsKey } from '@/lib/query-keys';

export const getSettings = () => api.get<{ settings: WorkspaceSettings }>('/api/settings').then((r) => r.settings);
export const settingsQuery = () => queryOptions({ queryKey: settingsKey, queryFn: getSettings, staleTime: 60_000 });
export const useSettings = () => useQuery(settingsQuery());

export function useUpdateSettings() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdateSettingsBody) => api.patch<{ settings: WorkspaceSettings }>('/api/settings', body).then((r) => r.settings),
    onSuccess: (settings) => qc.setQueryData(settingsKey, settings),
  });
}
