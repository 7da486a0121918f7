// Query keys. Every key in the web app starts with one of these roots; a feature builds its own keys
// below one (`[...rootKeys.admin, 'users']`) and invalidates a whole root with it
// (`invalidateQueries({ queryKey: rootKeys.devices })`). Lint refuses a literal root anywhere else.
export const rootKeys = {
  admin: ['admin'],
  auth: ['auth'],
  costModel: ['cost-model'],
  devices: ['devices'],
  home: ['home'],
  lineupMetrics: ['lineup-metrics'],
  lineups: ['lineups'],
  patterns: ['patterns'],
  rates: ['rates'],
  runs: ['runs'],
  search: ['search'],
  settings: ['settings'],
  teardowns: ['teardowns'],
  tools: ['tools'],
} as const;

// Every query about one teardown starts with teardownScope(id), so invalidating that prefix after
// any change refreshes the figures panel too.
export const teardownScope = (id: number) => [...rootKeys.teardowns, id] as const;
export const deviceScope = (id: number) => [...rootKeys.devices, id] as const;
