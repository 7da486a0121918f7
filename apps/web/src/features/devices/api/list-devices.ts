import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DeviceDto, DeviceListQuery } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';

export const devicesKey = [...rootKeys.devices, 'list'] as const;
export const listDevices = (query: DeviceListQuery = {}) => api.get<{ devices: DeviceDto[] }>('/api/devices', { query }).then((r) => r.devices);
export const devicesQuery = (query: DeviceListQuery = {}) => queryOptions({ queryKey: [...devicesKey, query], queryFn: () => listDevices(query) });
export const useDevices = (query: DeviceListQuery = {}) => useQuery(devicesQuery(query));
