import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CommentDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export const commentsKey = (id: number) => [...teardownScope(id), 'comments'] as const;
export const getComments = (id: number) => api.get<{ comments: CommentDto[] }>(`/api/teardowns/${id}/comments`).then((r) => r.comments);
export const commentsQuery = (id: number) => queryOptions({ queryKey: commentsKey(id), queryFn: () => getComments(id) });
export const useComments = (id: number) => useQuery(commentsQuery(id));
