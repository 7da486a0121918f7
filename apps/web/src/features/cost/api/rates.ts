import { queryOptions, useQuery } from '@tanstack/react-query';
import type { RatesList } from '@splitcase/contracts';
import { api } from '@/lib/api-client';

export const ratesKey = ['rates'] as const;
export const getRates = () => api.get<RatesList>('/api/rates');
export const ratesQuery = () => queryOptions({ queryKey: ratesKey, queryFn: getRates });
export const useRates = () => useQuery(ratesQuery());
