// Query-key prefixes shared across features. Every query about one teardown starts with
// teardownScope(id), so invalidating that prefix after any change refreshes the figures panel too.
export const teardownScope = (id: number) => ['teardowns', id] as const;
export const deviceScope = (id: number) => ['devices', id] as const;
export const settingsKey = ['settings'] as const;
