import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ThreadComment } from '../../../shared/threads';
import { api } from '../../../lib/api-client';
import { threadsQueryOptions } from './get-threads';

export function editComment(commentId: number, body: string): Promise<ThreadComment> {
  return api.patch<ThreadComment>(`/api/comments/${commentId}`, { body });
}

export function deleteComment(commentId: number): Promise<void> {
  return api.delete(`/api/comments/${commentId}`);
}

export function useEditComment(mappingId: number, commentId: number) {
  const queryClient = useQueryClient();
  const invalidate = () => queryClient.invalidateQueries({ queryKey: threadsQueryOptions(mappingId).queryKey });
  return {
    edit: useMutation({ mutationFn: (body: string) => editComment(commentId, body), onSuccess: invalidate }),
    remove: useMutation({ mutationFn: () => deleteComment(commentId), onSuccess: invalidate }),
  };
}
