import { queryOptions, useQuery } from '@tanstack/react-query';
import type { VersionDetail } from '../../../shared/versions';
import { api } from '../../../lib/api-client';
import { versionKeys } from '../../../lib/query-keys';

export const getVersion = (mappingId: number, n: number) => api.get<VersionDetail>(`/api/mappings/${mappingId}/versions/${n}`);

export const versionQueryOptions = (mappingId: number, n: number) =>
  queryOptions({ queryKey: versionKeys.detail(mappingId, n), queryFn: () => getVersion(mappingId, n), staleTime: Infinity });

export function useVersion(mappingId: number, n: number) {
  return useQuery(versionQueryOptions(mappingId, n));
}
