import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PhotosResponse } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export const photosKey = (teardownId: number) => [...teardownScope(teardownId), 'photos'] as const;
export const getPhotos = (teardownId: number) => api.get<PhotosResponse>(`/api/teardowns/${teardownId}/photos`);
export const photosQuery = (teardownId: number) => queryOptions({ queryKey: photosKey(teardownId), queryFn: () => getPhotos(teardownId) });
export const usePhotos = (teardownId: number) => useQuery(photosQuery(teardownId));
