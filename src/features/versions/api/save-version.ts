import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SaveVersionBody, VersionSummary } from '../../../shared/versions';
import { api } from '../../../lib/api-client';
import { mappingKeys } from '../../../lib/query-keys';

export const saveVersion = (mappingId: number, body: SaveVersionBody) => api.post<VersionSummary>(`/api/mappings/${mappingId}/versions`, body);

/** Saving, restoring, locking and unlocking all change the mapping's history: refresh everything under it. */
export function useMappingHistoryMutation<T, A>(mappingId: number, fn: (arg: A) => Promise<T>) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: fn, onSuccess: () => queryClient.invalidateQueries({ queryKey: mappingKeys.detail(mappingId) }) });
}

export function useSaveVersion(mappingId: number) {
  return useMappingHistoryMutation(mappingId, (body: SaveVersionBody) => saveVersion(mappingId, body));
}
