import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LoginBody, User } from '@splitcase/contracts';
import { api, resetCsrfToken } from '@/lib/api-client';
import { meKey } from '@/lib/session';

export const login = (body: LoginBody) => api.post<{ user: User }>('/api/auth/login', body);

export function useLogin() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: login,
    onSuccess: ({ user }) => {
      resetCsrfToken(); // the server started a new session
      qc.clear();
      qc.setQueryData(meKey, user);
    },
  });
}
