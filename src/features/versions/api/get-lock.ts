import { queryOptions, useQuery } from '@tanstack/react-query';
import type { LockState } from '../../../shared/versions';
import { api } from '../../../lib/api-client';
import { versionKeys } from '../../../lib/query-keys';

export const getLock = (mappingId: number) => api.get<LockState>(`/api/mappings/${mappingId}/lock`);

export const lockQueryOptions = (mappingId: number) => queryOptions({ queryKey: versionKeys.lock(mappingId), queryFn: () => getLock(mappingId) });

export function useLock(mappingId: number) {
  return useQuery(lockQueryOptions(mappingId));
}
