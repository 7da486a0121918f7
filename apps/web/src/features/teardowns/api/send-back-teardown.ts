import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SendBackTeardownBody, TeardownDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { afterReviewStep } from './review';

export const sendBackTeardown = (id: number, body: SendBackTeardownBody) => api.post<{ teardown: TeardownDto }>(`/api/teardowns/${id}/send-back`, body).then((r) => r.teardown);

export function useSendBackTeardown(id: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: (body: SendBackTeardownBody) => sendBackTeardown(id, body), onSuccess: (t) => afterReviewStep(qc, t) });
}
