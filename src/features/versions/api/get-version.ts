import { queryOptions, useQuery } from '@tanstack/react-query';
import type { VersionDetail } from '../../../shared/versions';
import { api } from '../../../lib/api-client';

export const getVersion = (mappingId: number, n: number) => api.get<VersionDetail>(`/api/mappings/${mappingId}/versions/${n}`);

export const versionQueryOptions = (mappingId: number, n: number) =>
  queryOptions({ queryKey: ['mappings', mappingId, 'versions', n], queryFn: () => getVersion(mappingId, n), staleTime: Infinity });

export function useVersion(mappingId: number, n: number) {
  return useQuery(versionQueryOptions(mappingId, n));
}
