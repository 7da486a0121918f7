import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PartDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export const partsKey = (teardownId: number) => [...teardownScope(teardownId), 'parts'] as const;
export const getParts = (teardownId: number) => api.get<{ parts: PartDto[] }>(`/api/teardowns/${teardownId}/parts`).then((r) => r.parts);
export const partsQuery = (teardownId: number) => queryOptions({ queryKey: partsKey(teardownId), queryFn: () => getParts(teardownId) });
export const useParts = (teardownId: number) => useQuery(partsQuery(teardownId));
/** The CSV download (a plain link: the session cookie goes with it). */
export const partsCsvUrl = (teardownId: number) => `/api/teardowns/${teardownId}/parts.csv`;
