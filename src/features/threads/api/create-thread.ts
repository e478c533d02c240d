import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateThreadBody, Thread } from '../../../shared/threads';
import { api } from '../../../lib/api-client';
import { upsertThread } from './get-threads';

export function createThread(mappingId: number, body: CreateThreadBody): Promise<Thread> {
  return api.post<Thread>(`/api/mappings/${mappingId}/threads`, body);
}

export function useCreateThread(mappingId: number) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: (body: CreateThreadBody) => createThread(mappingId, body), onSuccess: (thread) => upsertThread(queryClient, thread) });
}
