import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Invitation } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';

export const invitationsKey = [...rootKeys.admin, 'invitations'] as const;
export const getInvitations = () => api.get<{ invitations: Invitation[] }>('/api/invitations').then((r) => r.invitations);
export const invitationsQuery = () => queryOptions({ queryKey: invitationsKey, queryFn: getInvitations });
export const useInvitations = () => useQuery(invitationsQuery());
