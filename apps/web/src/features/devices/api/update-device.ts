import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { DeviceDto, DeviceFormValues } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';

export const updateDevice = ({ id, ...body }: Partial<DeviceFormValues> & { id: number }) => api.patch<{ device: DeviceDto }>(`/api/devices/${id}`, body).then((r) => r.device);

export function useUpdateDevice() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: updateDevice,
    // Label claims feed the figures of every teardown of the device.
    onSuccess: () => Promise.all([qc.invalidateQueries({ queryKey: rootKeys.devices }), qc.invalidateQueries({ queryKey: rootKeys.teardowns })]),
  });
}
