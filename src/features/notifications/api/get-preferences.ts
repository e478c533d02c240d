import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Preferences } from '../../../shared/notifications';
import { api } from '../../../lib/api-client';
import { meKeys } from '../../../lib/query-keys';

export function getPreferences(): Promise<Preferences> {
  return api.get<Preferences>('/api/me/preferences');
}

export const preferencesQueryOptions = () => queryOptions({ queryKey: meKeys.preferences(), queryFn: getPreferences });

export function usePreferences() {
  return useQuery(preferencesQueryOptions());
}
