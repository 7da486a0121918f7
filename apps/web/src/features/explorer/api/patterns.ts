import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PatternsResponse } from '@splitcase/contracts';
import { api } from '@/lib/api-client';

export const patternsKey = ['patterns'] as const;
export const getPatterns = () => api.get<PatternsResponse>('/api/patterns');
export const patternsQuery = () => queryOptions({ queryKey: patternsKey, queryFn: getPatterns, staleTime: 60_000 });
export const usePatterns = () => useQuery(patternsQuery());
