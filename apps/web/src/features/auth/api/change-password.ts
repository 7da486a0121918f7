import { useMutation } from '@tanstack/react-query';
import type { ChangePasswordBody } from '@splitcase/contracts';
import { api, resetCsrfToken } from '@/lib/api-client';

export const changePassword = (body: ChangePasswordBody) => api.post<void>('/api/auth/password', body);

/** The server gives this session a new id (and CSRF token) after the change. */
export const useChangePassword = () => useMutation({ mutationFn: changePassword, onSuccess: () => resetCsrfToken() });
