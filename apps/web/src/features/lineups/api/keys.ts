// Query keys of the lineups feature: everything about one lineup starts with lineupScope(id).
export const lineupsKey = ['lineups'] as const;
export const lineupScope = (id: number) => ['lineups', id] as const;
