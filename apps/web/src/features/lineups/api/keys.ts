import { rootKeys } from '@/lib/query-keys';

// Query keys of the lineups feature: everything about one lineup starts with lineupScope(id).
export const lineupScope = (id: number) => [...rootKeys.lineups, id] as const;
