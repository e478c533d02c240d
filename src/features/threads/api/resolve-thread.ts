import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Thread } from '../../../shared/threads';
import { api } from '../../../lib/api-client';
import { upsertThread } from './get-threads';

export function resolveThread(threadId: number, resolved: boolean): Promise<Thread> {
  return api.patch<Thread>(`/api/threads/${threadId}`, { resolved });
}

export function useResolveThread(threadId: number) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: (resolved: boolean) => resolveThread(threadId, resolved), onSuccess: (thread) => upsertThread(queryClient, thread) });
}
