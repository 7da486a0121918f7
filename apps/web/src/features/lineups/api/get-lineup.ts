import { queryOptions, useQuery } from '@tanstack/react-query';
import type { LineupDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { lineupScope } from './keys';

export const getLineup = (id: number) => api.get<{ lineup: LineupDto }>(`/api/lineups/${id}`).then((r) => r.lineup);
export const lineupQuery = (id: number) => queryOptions({ queryKey: [...lineupScope(id), 'detail'] as const, queryFn: () => getLineup(id) });
export const useLineup = (id: number) => useQuery(lineupQuery(id));
