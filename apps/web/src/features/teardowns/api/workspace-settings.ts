import { queryOptions, useQuery } from '@tanstack/react-query';
import type { WorkspaceSettings } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { settingsKey } from '@/lib/query-keys';

export const getWorkspaceSettings = () => api.get<{ settings: WorkspaceSettings }>('/api/settings').then((r) => r.settings);
export const workspaceSettingsQuery = () => queryOptions({ queryKey: settingsKey, queryFn: getWorkspaceSettings, staleTime: 5 * 60_000 });
export const useWorkspaceSettings = () => useQuery(workspaceSettingsQuery());
