import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MeasurementDto, UpdateMeasurementBody } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';
import { teardownScope } from '@/lib/query-keys';

export const updateMeasurement = ({ id, body }: { id: number; body: UpdateMeasurementBody }) =>
  withUnpublishConfirm((opts) => api.patch<{ measurement: MeasurementDto }>(`/api/measurements/${id}`, body, opts)).then((r) => r.measurement);

export function useUpdateMeasurement(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updateMeasurement, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
