import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { DeviceDto, DeviceFormValues } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';

export const createDevice = (body: DeviceFormValues) => api.post<{ device: DeviceDto }>('/api/devices', body).then((r) => r.device);

export function useCreateDevice() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createDevice, onSuccess: () => qc.invalidateQueries({ queryKey: rootKeys.devices }) });
}
