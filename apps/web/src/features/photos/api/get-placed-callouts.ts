import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PlacedCalloutDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export interface PlacedCalloutsFilter {
  partId?: number;
  findingId?: number;
}

export const placedCalloutsKey = (teardownId: number, filter: PlacedCalloutsFilter) => [...teardownScope(teardownId), 'callouts', filter] as const;
export const getPlacedCallouts = (teardownId: number, filter: PlacedCalloutsFilter) =>
  api.get<{ callouts: PlacedCalloutDto[] }>(`/api/teardowns/${teardownId}/callouts`, { query: { partId: filter.partId, findingId: filter.findingId } }).then((r) => r.callouts);
export const placedCalloutsQuery = (teardownId: number, filter: PlacedCalloutsFilter) =>
  queryOptions({ queryKey: placedCalloutsKey(teardownId, filter), queryFn: () => getPlacedCallouts(teardownId, filter) });
export const usePlacedCallouts = (teardownId: number, filter: PlacedCalloutsFilter) => useQuery(placedCalloutsQuery(teardownId, filter));
