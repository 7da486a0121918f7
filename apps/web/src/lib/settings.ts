import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { UpdateSettingsBody, WorkspaceSettings } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';

// The workspace settings: one module for every feature that reads or changes them (admin, bench runs,
// cost, teardowns).
export const getSettings = () => api.get<{ settings: WorkspaceSettings }>('/api/settings').then((r) => r.settings);
export const settingsQuery = () => queryOptions({ queryKey: rootKeys.settings, queryFn: getSettings, staleTime: 60_000 });
export const useSettings = () => useQuery(settingsQuery());

export const updateSettings = (body: UpdateSettingsBody) => api.patch<{ settings: WorkspaceSettings }>('/api/settings', body).then((r) => r.settings);

/** What settings change is read again: every figure and roll-up (contact times, usable share, cut-off, capacity warning, currency, sales tax) under teardowns, lineups and runs, the lineup metrics (their currency) and the pattern counts (the capacity warning). */
const FOLLOW_SETTINGS = [rootKeys.teardowns, rootKeys.lineups, rootKeys.lineupMetrics, rootKeys.runs, rootKeys.patterns];

/** PATCH /api/settings with the fields to change (the others stay). */
export function useUpdateSettings() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: updateSettings,
    onSuccess: (settings) => {
      qc.setQueryData(rootKeys.settings, settings);
      return Promise.all(FOLLOW_SETTINGS.map((queryKey) => qc.invalidateQueries({ queryKey })));
    },
  });
}
