import { useEffect } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { notificationsQueryOptions } from '../api/get-notifications';

/** Refetches the bell's list whenever the person's notification stream says it changed (and on reconnect). */
export function useNotificationEvents(): void {
  const queryClient = useQueryClient();
  useEffect(() => {
    const source = new EventSource('/api/notifications/events');
    const refresh = () => void queryClient.invalidateQueries({ queryKey: notificationsQueryOptions().queryKey });
    source.addEventListener('open', refresh);
    source.addEventListener('notifications', refresh);
    return () => source.close();
  }, [queryClient]);
}
