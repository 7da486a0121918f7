import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateInvitationBody, Invitation } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { invitationsKey } from './invitations';
import { outboxKey } from './outbox';

export const createInvitation = (body: CreateInvitationBody) => api.post<{ invitation: Invitation }>('/api/invitations', body);

export function useCreateInvitation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: createInvitation,
    onSuccess: () => {
      qc.invalidateQueries({ queryKey: invitationsKey });
      qc.invalidateQueries({ queryKey: outboxKey });
    },
  });
}
