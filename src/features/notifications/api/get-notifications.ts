import { queryOptions, useQuery } from '@tanstack/react-query';
import type { NotificationList } from '../../../shared/notifications';
import { api } from '../../../lib/api-client';
import { notificationKeys } from '../../../lib/query-keys';

export function getNotifications(): Promise<NotificationList> {
  return api.get<NotificationList>('/api/notifications');
}

export const notificationsQueryOptions = () => queryOptions({ queryKey: notificationKeys.list(), queryFn: getNotifications });

export function useNotifications() {
  return useQuery(notificationsQueryOptions());
}
