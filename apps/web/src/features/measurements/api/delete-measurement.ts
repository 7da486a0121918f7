import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';
import { teardownScope } from '@/lib/query-keys';

export const deleteMeasurement = ({ id }: { id: number }) => withUnpublishConfirm((opts) => api.delete<void>(`/api/measurements/${id}`, opts));

export function useDeleteMeasurement(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deleteMeasurement, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
