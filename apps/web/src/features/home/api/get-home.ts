import { queryOptions, useQuery } from '@tanstack/react-query';
import type { HomeResponse } from '@splitcase/contracts';
import { api } from '@/lib/api-client';

export const homeKey = ['home'] as const;
export const getHome = () => api.get<HomeResponse>('/api/home');
export const homeQuery = () => queryOptions({ queryKey: homeKey, queryFn: getHome });
export const useHome = () => useQuery(homeQuery());
