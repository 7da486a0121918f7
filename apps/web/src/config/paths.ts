// Every URL of the web app comes from here.
export const paths = {
  home: () => '/',
  signIn: (next?: string) => (next && next !== '/' ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in'),
  forgotPassword: () => '/forgot-password',
  resetPassword: () => '/reset-password',
  acceptInvitation: () => '/accept-invitation',
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
