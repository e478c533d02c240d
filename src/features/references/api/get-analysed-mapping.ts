import { useQuery } from '@tanstack/react-query';
import type { Mapping } from '../../../shared/chem';
import type { MappingDetail } from '../../../shared/mappings';
import type { VersionDetail } from '../../../shared/versions';
import { api } from '../../../lib/api-client';
import { mappingKeys, versionKeys } from '../../../lib/query-keys';

/**
 * The beads of the state an analysis was made of: a saved version (immutable, read once) or the
 * draft as it is now. Same keys and shapes as the mapping and version pages, so they share the cache.
 */
export function useAnalysedMapping(mappingId: number, versionNumber: number | null) {
  const version = useQuery({
    queryKey: versionKeys.detail(mappingId, versionNumber ?? 0),
    queryFn: () => api.get<VersionDetail>(`/api/mappings/${mappingId}/versions/${versionNumber}`),
    staleTime: Infinity,
    enabled: versionNumber !== null,
  });
  const draft = useQuery({
    queryKey: mappingKeys.detail(mappingId),
    queryFn: () => api.get<MappingDetail>(`/api/mappings/${mappingId}`),
    refetchOnWindowFocus: false,
    enabled: versionNumber === null,
  });
  const q = versionNumber === null ? draft : version;
  return { data: q.data?.draft as Mapping | undefined, error: q.error, isPending: q.isPending };
}
