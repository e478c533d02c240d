import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MarkReadBody } from '../../../shared/notifications';
import { api } from '../../../lib/api-client';
import { notificationsQueryOptions } from './get-notifications';

export function markRead(body: MarkReadBody): Promise<{ unread: number }> {
  return api.post<{ unread: number }>('/api/notifications/read', body);
}

export function useMarkRead() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: markRead, onSuccess: () => queryClient.invalidateQueries({ queryKey: notificationsQueryOptions().queryKey }) });
}
