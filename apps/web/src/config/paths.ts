// Every URL of the web app comes from here.
export type TeardownSection = 'overview' | 'photos' | 'parts' | 'power' | 'measurements' | 'runs' | 'findings' | 'cost' | 'comments' | 'history';

/** Panels of the bench-tools page, in tab order. */
export const TOOL_TABS = ['marking', 'heater-trace', 'runtime'] as const;
export type ToolTab = (typeof TOOL_TABS)[number];

export const paths = {
  home: () => '/',
  signIn: (next?: string) => (next && next !== '/' ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in'),
  forgotPassword: () => '/forgot-password',
  resetPassword: () => '/reset-password',
  acceptInvitation: () => '/accept-invitation',
  account: () => '/account',
  devices: () => '/devices',
  device: (id: number) => `/devices/${id}`,
  newDevice: () => '/devices/new',
  editDevice: (id: number) => `/devices/${id}/edit`,
  teardown: (id: number, section: TeardownSection = 'overview') => (section === 'overview' ? `/teardowns/${id}` : `/teardowns/${id}/${section}`),
  teardownRun: (teardownId: number, runId: number) => `/teardowns/${teardownId}/runs?run=${runId}`,
  benchRuns: () => '/bench/runs',
  admin: {
    users: () => '/admin/users',
    invitations: () => '/admin/invitations',
    outbox: () => '/admin/outbox',
    audit: () => '/admin/audit',
    /** Contact times and the usable share behind the touch and runtime figures. */
    figures: () => '/admin/figures',
  },
  tools: (tool?: ToolTab) => (tool && tool !== 'marking' ? `/tools?tool=${tool}` : '/tools'),
  api: {
    docs: () => '/api/docs',
  },
  /** A photo on the stage of the photos section, optionally with one pin selected. */
  teardownPhoto: (id: number, photoId: number, pinId?: number) => `/teardowns/${id}/photos?photo=${photoId}${pinId ? `&pin=${pinId}` : ''}`,
  rates: () => '/rates',
  /** The findings explorer; `query` is a search as contracts' searchStateToQuery writes it. */
  findings: (query?: string) => (query ? `/findings?${query}` : '/findings'),
  lineups: () => '/lineups',
  newLineup: () => '/lineups/new',
  lineup: (id: number) => `/lineups/${id}`,
  editLineup: (id: number) => `/lineups/${id}/edit`,
  /** The printable lineup report, with the chart's axes. */
  lineupPrint: (id: number, axes?: { x?: string | null; y?: string | null }) => {
    const q = new URLSearchParams();
    if (axes?.x) q.set('x', axes.x);
    if (axes?.y) q.set('y', axes.y);
    const qs = q.toString();
    return `/lineups/${id}/print${qs ? `?${qs}` : ''}`;
  },
  /** The printable lab report of a teardown (its own page, without the rails). */
  teardownReport: (id: number) => `/teardowns/${id}/report`,
} as const;
