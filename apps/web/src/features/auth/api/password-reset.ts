import { useMutation } from '@tanstack/react-query';
import type { ResetConfirmBody, ResetRequestBody } from '@splitcase/contracts';
import { api } from '@/lib/api-client';

export const useRequestReset = () => useMutation({ mutationFn: (body: ResetRequestBody) => api.post<{ ok: true; message: string }>('/api/auth/password-reset/request', body) });

export const useConfirmReset = () => useMutation({ mutationFn: (body: ResetConfirmBody) => api.post<void>('/api/auth/password-reset/confirm', body) });
