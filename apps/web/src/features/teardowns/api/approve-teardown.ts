import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { TeardownDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { afterReviewStep } from './review';

export const approveTeardown = (id: number, note?: string) => api.post<{ teardown: TeardownDto }>(`/api/teardowns/${id}/approve`, { note: note ?? '' }).then((r) => r.teardown);

export function useApproveTeardown(id: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: (note?: string) => approveTeardown(id, note), onSuccess: (t) => afterReviewStep(qc, t) });
}
