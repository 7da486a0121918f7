import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ConverterDto, CreateConverterBody } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';
import { teardownScope } from '@/lib/query-keys';

export const createConverter = ({ teardownId, body }: { teardownId: number; body: CreateConverterBody }) =>
  withUnpublishConfirm((opts) => api.post<{ converter: ConverterDto }>(`/api/teardowns/${teardownId}/converters`, body, opts)).then((r) => r.converter);

export function useCreateConverter(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createConverter, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
