import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PatternsResponse } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';

export const getPatterns = () => api.get<PatternsResponse>('/api/patterns');
export const patternsQuery = () => queryOptions({ queryKey: rootKeys.patterns, queryFn: getPatterns, staleTime: 60_000 });
export const usePatterns = () => useQuery(patternsQuery());
