import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DeviceDto, DeviceTeardown } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { deviceScope } from '@/lib/query-keys';

export const deviceKey = (id: number) => [...deviceScope(id), 'detail'] as const;
export const getDevice = (id: number) => api.get<{ device: DeviceDto; teardowns: DeviceTeardown[] }>(`/api/devices/${id}`);
export const deviceQuery = (id: number) => queryOptions({ queryKey: deviceKey(id), queryFn: () => getDevice(id) });
export const useDevice = (id: number) => useQuery(deviceQuery(id));
