import { queryOptions, useQuery } from '@tanstack/react-query';
import type { VersionSummary } from '../../../shared/versions';
import { api } from '../../../lib/api-client';
import { versionKeys } from '../../../lib/query-keys';

export const getVersions = (mappingId: number) => api.get<VersionSummary[]>(`/api/mappings/${mappingId}/versions`);

export const versionsQueryOptions = (mappingId: number) => queryOptions({ queryKey: versionKeys.list(mappingId), queryFn: () => getVersions(mappingId) });

export function useVersions(mappingId: number) {
  return useQuery(versionsQueryOptions(mappingId));
}
