import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, resetCsrfToken } from '@/lib/api-client';
import { meKey } from '@/lib/session';

export const logout = () => api.post<void>('/api/auth/logout');

/**
 * Sign out. The user becomes null first, so RequireAuth leaves the page; the rest of the cache (the
 * previous user's data) goes a moment later, once nothing shows it: clearing it while the page is
 * still mounted made the page fetch again, signed out (401 in the console).
 */
export function useLogout() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: logout,
    onSettled: async () => {
      resetCsrfToken();
      await qc.cancelQueries();
      qc.setQueryData(meKey, null);
      setTimeout(() => qc.removeQueries({ predicate: (q) => q.queryHash !== JSON.stringify(meKey) }), 0);
    },
  });
}
