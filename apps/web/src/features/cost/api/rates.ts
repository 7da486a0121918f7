import { queryOptions, useQuery } from '@tanstack/react-query';
import type { RatesList } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';

export const getRates = () => api.get<RatesList>('/api/rates');
export const ratesQuery = () => queryOptions({ queryKey: rootKeys.rates, queryFn: getRates });
export const useRates = () => useQuery(ratesQuery());
