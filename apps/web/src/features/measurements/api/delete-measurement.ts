import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export const deleteMeasurement = ({ id, headers }: { id: number; headers?: Record<string, string> }) => api.delete<void>(`/api/measurements/${id}`, { headers });

export function useDeleteMeasurement(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deleteMeasurement, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
