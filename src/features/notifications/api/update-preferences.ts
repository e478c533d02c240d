import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Preferences } from '../../../shared/notifications';
import { api } from '../../../lib/api-client';
import { preferencesQueryOptions } from './get-preferences';

export function updatePreferences(body: Preferences): Promise<Preferences> {
  return api.put<Preferences>('/api/me/preferences', body);
}

export function useUpdatePreferences() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: updatePreferences, onSuccess: (prefs) => queryClient.setQueryData(preferencesQueryOptions().queryKey, prefs) });
}
