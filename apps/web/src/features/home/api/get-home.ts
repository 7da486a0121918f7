import { queryOptions, useQuery } from '@tanstack/react-query';
import type { HomeResponse } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';

export const getHome = () => api.get<HomeResponse>('/api/home');
// Always fresh when the page opens: it sums up changes made anywhere else a moment ago.
export const homeQuery = () => queryOptions({ queryKey: rootKeys.home, queryFn: getHome, staleTime: 0 });
export const useHome = () => useQuery(homeQuery());
