import { queryOptions, useQuery } from '@tanstack/react-query';
import type { FindingDto, LinkablePart, LinkablePhoto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export interface FindingsData {
  findings: FindingDto[];
  parts: LinkablePart[];
  photos: LinkablePhoto[];
}

export const findingsKey = (teardownId: number) => [...teardownScope(teardownId), 'findings'] as const;
export const listFindings = (teardownId: number) => api.get<FindingsData>(`/api/teardowns/${teardownId}/findings`);
export const findingsQuery = (teardownId: number) => queryOptions({ queryKey: findingsKey(teardownId), queryFn: () => listFindings(teardownId) });
export const useFindings = (teardownId: number) => useQuery(findingsQuery(teardownId));
