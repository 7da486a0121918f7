import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PowerSystemDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export const powerKey = (teardownId: number) => [...teardownScope(teardownId), 'power'] as const;
export const getPower = (teardownId: number) => api.get<PowerSystemDto>(`/api/teardowns/${teardownId}/power`);
export const powerQuery = (teardownId: number) => queryOptions({ queryKey: powerKey(teardownId), queryFn: () => getPower(teardownId) });
export const usePower = (teardownId: number) => useQuery(powerQuery(teardownId));
