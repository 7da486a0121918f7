// Every URL of the web app comes from here.
export type TeardownSection = 'overview' | 'photos' | 'parts' | 'power' | 'measurements' | 'runs' | 'findings' | 'cost' | 'comments' | 'history';

export const paths = {
  home: () => '/',
  signIn: (next?: string) => (next && next !== '/' ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in'),
  forgotPassword: () => '/forgot-password',
  resetPassword: () => '/reset-password',
  acceptInvitation: () => '/accept-invitation',
  devices: () => '/devices',
  device: (id: number) => `/devices/${id}`,
  newDevice: () => '/devices/new',
  editDevice: (id: number) => `/devices/${id}/edit`,
  teardown: (id: number, section: TeardownSection = 'overview') => (section === 'overview' ? `/teardowns/${id}` : `/teardowns/${id}/${section}`),
  admin: {
    users: () => '/admin/users',
    invitations: () => '/admin/invitations',
    outbox: () => '/admin/outbox',
    audit: () => '/admin/audit',
  },
  api: {
    docs: () => '/api/docs',
  },
} as const;
