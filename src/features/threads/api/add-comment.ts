import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ThreadComment } from '../../../shared/threads';
import { api } from '../../../lib/api-client';
import { threadsQueryOptions } from './get-threads';

export function addComment(threadId: number, body: string): Promise<ThreadComment> {
  return api.post<ThreadComment>(`/api/threads/${threadId}/comments`, { body });
}

export function useAddComment(mappingId: number, threadId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: string) => addComment(threadId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: threadsQueryOptions(mappingId).queryKey }),
  });
}
