import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';

export const deleteDevice = (id: number) => api.delete<void>(`/api/devices/${id}`);

export function useDeleteDevice() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deleteDevice, onSuccess: () => qc.invalidateQueries({ queryKey: rootKeys.devices }) });
}
