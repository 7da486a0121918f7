import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateMeasurementBody, MeasurementDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';
import { teardownScope } from '@/lib/query-keys';

export const createMeasurement = ({ teardownId, body }: { teardownId: number; body: CreateMeasurementBody }) =>
  withUnpublishConfirm((opts) => api.post<{ measurement: MeasurementDto }>(`/api/teardowns/${teardownId}/measurements`, body, opts)).then((r) => r.measurement);

export function useCreateMeasurement(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createMeasurement, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
