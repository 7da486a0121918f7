import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateTeardownForm, TeardownDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';

export const createTeardown = (body: CreateTeardownForm) => api.post<{ teardown: TeardownDto }>('/api/teardowns', body).then((r) => r.teardown);

export function useCreateTeardown() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createTeardown, onSuccess: () => qc.invalidateQueries({ queryKey: rootKeys.devices }) });
}
