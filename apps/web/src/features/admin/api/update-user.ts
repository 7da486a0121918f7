import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AdminUser, UpdateUserBody } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { usersKey } from './users';

export const updateUser = ({ id, ...body }: UpdateUserBody & { id: number }) => api.patch<{ user: AdminUser }>(`/api/users/${id}`, body);

export function useUpdateUser() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updateUser, onSuccess: () => qc.invalidateQueries({ queryKey: usersKey }) });
}
