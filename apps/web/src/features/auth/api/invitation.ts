import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { AcceptInvitationBody, Role, User } from '@splitcase/contracts';
import { api, resetCsrfToken } from '@/lib/api-client';
import { meKey } from '@/lib/session';
import { rootKeys } from '@/lib/query-keys';

export interface InvitationPreview {
  email: string;
  role: Role;
  expiresAt: string;
}

export const getInvitationPreview = (token: string) => api.get<{ invitation: InvitationPreview }>('/api/auth/invitations/preview', { query: { token } }).then((r) => r.invitation);

export const invitationPreviewQuery = (token: string) =>
  queryOptions({ queryKey: [...rootKeys.auth, 'invitation', token], queryFn: () => getInvitationPreview(token), retry: false, enabled: token.length > 0 });

export const useInvitationPreview = (token: string) => useQuery(invitationPreviewQuery(token));

export function useAcceptInvitation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: AcceptInvitationBody) => api.post<{ user: User }>('/api/auth/invitations/accept', body),
    onSuccess: ({ user }) => {
      resetCsrfToken();
      qc.clear();
      qc.setQueryData(meKey, user);
    },
  });
}
