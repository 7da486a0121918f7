import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { TeardownDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { afterReviewStep } from './review';

/** In review → draft, by its engineer or an admin, to edit it (a teardown in review is read-only). */
export const withdrawTeardown = (id: number) => api.post<{ teardown: TeardownDto }>(`/api/teardowns/${id}/withdraw`).then((r) => r.teardown);

export function useWithdrawTeardown(id: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: () => withdrawTeardown(id), onSuccess: (t) => afterReviewStep(qc, t) });
}
