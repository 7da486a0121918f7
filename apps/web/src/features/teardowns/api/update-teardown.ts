import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { TeardownDto, UpdateTeardownForm } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys, teardownScope } from '@/lib/query-keys';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';
import { teardownKey } from './get-teardown';

/** PATCH with the version edited; a published teardown asks first (and goes back to draft). */
export const updateTeardown = (id: number, body: UpdateTeardownForm) =>
  withUnpublishConfirm((opts) => api.patch<{ teardown: TeardownDto }>(`/api/teardowns/${id}`, body, opts)).then((r) => r.teardown);

export function useUpdateTeardown(id: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdateTeardownForm) => updateTeardown(id, body),
    onSuccess: (t) => {
      qc.setQueryData(teardownKey(id), t);
      return Promise.all([qc.invalidateQueries({ queryKey: teardownScope(id) }), qc.invalidateQueries({ queryKey: rootKeys.devices })]);
    },
  });
}
