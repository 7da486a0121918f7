import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateMeasurementBody, MeasurementDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export const createMeasurement = ({ teardownId, body, headers }: { teardownId: number; body: CreateMeasurementBody; headers?: Record<string, string> }) =>
  api.post<{ measurement: MeasurementDto }>(`/api/teardowns/${teardownId}/measurements`, body, { headers }).then((r) => r.measurement);

export function useCreateMeasurement(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createMeasurement, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
