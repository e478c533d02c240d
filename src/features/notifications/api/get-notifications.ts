import { queryOptions, useQuery } from '@tanstack/react-query';
import type { NotificationList } from '../../../shared/notifications';
import { api } from '../../../lib/api-client';

export function getNotifications(): Promise<NotificationList> {
  return api.get<NotificationList>('/api/notifications');
}

export const notificationsQueryOptions = () => queryOptions({ queryKey: ['notifications'], queryFn: getNotifications });

export function useNotifications() {
  return useQuery(notificationsQueryOptions());
}
