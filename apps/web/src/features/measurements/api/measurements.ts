import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MeasurementDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export const measurementsKey = (teardownId: number) => [...teardownScope(teardownId), 'measurements'] as const;
export const getMeasurements = (teardownId: number) => api.get<{ measurements: MeasurementDto[] }>(`/api/teardowns/${teardownId}/measurements`).then((r) => r.measurements);
export const measurementsQuery = (teardownId: number) => queryOptions({ queryKey: measurementsKey(teardownId), queryFn: () => getMeasurements(teardownId) });
export const useMeasurements = (teardownId: number) => useQuery(measurementsQuery(teardownId));
export const measurementsCsvUrl = (teardownId: number) => `/api/teardowns/${teardownId}/measurements.csv`;
