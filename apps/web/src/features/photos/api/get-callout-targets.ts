import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CalloutTargets } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export const calloutTargetsKey = (teardownId: number) => [...teardownScope(teardownId), 'callout-targets'] as const;
export const getCalloutTargets = (teardownId: number) => api.get<CalloutTargets>(`/api/teardowns/${teardownId}/callout-targets`);
export const calloutTargetsQuery = (teardownId: number) => queryOptions({ queryKey: calloutTargetsKey(teardownId), queryFn: () => getCalloutTargets(teardownId) });
export const useCalloutTargets = (teardownId: number, enabled = true) => useQuery({ ...calloutTargetsQuery(teardownId), enabled });
