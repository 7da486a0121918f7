import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, resetCsrfToken } from '@/lib/api-client';
import { meKey } from '@/lib/session';

export const logout = () => api.post<void>('/api/auth/logout');

export function useLogout() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: logout,
    onSettled: () => {
      resetCsrfToken();
      qc.clear();
      qc.setQueryData(meKey, null);
    },
  });
}
