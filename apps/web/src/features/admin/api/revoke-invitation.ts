import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { invitationsKey } from './invitations';

export const revokeInvitation = (id: number) => api.delete<void>(`/api/invitations/${id}`);

export function useRevokeInvitation() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: revokeInvitation, onSuccess: () => qc.invalidateQueries({ queryKey: invitationsKey }) });
}
