import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CommentDto, CreateCommentBody } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export const postComment = (id: number, body: CreateCommentBody) => api.post<{ comment: CommentDto }>(`/api/teardowns/${id}/comments`, body).then((r) => r.comment);

export function usePostComment(id: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: (body: CreateCommentBody) => postComment(id, body), onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(id) }) });
}
