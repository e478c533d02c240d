import { queryOptions, useQuery } from '@tanstack/react-query';
import type { VersionSummary } from '../../../shared/versions';
import { api } from '../../../lib/api-client';
import { versionKeys } from '../../../lib/query-keys';

// The saved versions of a mapping a new one may start from (same key as the history's list, so the
// two share one cache entry).
export const sourceVersionsQueryOptions = (mappingId: number) =>
  queryOptions({ queryKey: versionKeys.list(mappingId), queryFn: () => api.get<VersionSummary[]>(`/api/mappings/${mappingId}/versions`) });

export function useSourceVersions(mappingId: number | null) {
  return useQuery({ ...sourceVersionsQueryOptions(mappingId ?? 0), enabled: mappingId !== null });
}
