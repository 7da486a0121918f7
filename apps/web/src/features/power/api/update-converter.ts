import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ConverterDto, UpdateConverterBody } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';
import { teardownScope } from '@/lib/query-keys';

export const updateConverter = ({ teardownId, id, body }: { teardownId: number; id: number; body: UpdateConverterBody }) =>
  withUnpublishConfirm((opts) => api.patch<{ converter: ConverterDto }>(`/api/teardowns/${teardownId}/converters/${id}`, body, opts)).then((r) => r.converter);

export function useUpdateConverter(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updateConverter, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
