import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ConverterDto, CreateConverterBody } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export const createConverter = ({ teardownId, body, headers }: { teardownId: number; body: CreateConverterBody; headers?: Record<string, string> }) =>
  api.post<{ converter: ConverterDto }>(`/api/teardowns/${teardownId}/converters`, body, { headers }).then((r) => r.converter);

export function useCreateConverter(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createConverter, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
