import { queryOptions, useQuery } from '@tanstack/react-query';
import type { LineupDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';

export const listLineups = () => api.get<{ lineups: LineupDto[]; canCreate: boolean }>('/api/lineups');
export const lineupsQuery = () => queryOptions({ queryKey: [...rootKeys.lineups, 'list'] as const, queryFn: listLineups });
export const useLineups = () => useQuery(lineupsQuery());
