import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MeasurementDto, UpdateMeasurementBody } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export const updateMeasurement = ({ id, body, headers }: { id: number; body: UpdateMeasurementBody; headers?: Record<string, string> }) =>
  api.patch<{ measurement: MeasurementDto }>(`/api/measurements/${id}`, body, { headers }).then((r) => r.measurement);

export function useUpdateMeasurement(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updateMeasurement, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
