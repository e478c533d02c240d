import { queryOptions, useQuery } from '@tanstack/react-query';
import type { VersionSummary } from '../../../shared/versions';
import { api } from '../../../lib/api-client';

export const getVersions = (mappingId: number) => api.get<VersionSummary[]>(`/api/mappings/${mappingId}/versions`);

export const versionsQueryOptions = (mappingId: number) => queryOptions({ queryKey: ['mappings', mappingId, 'versions'], queryFn: () => getVersions(mappingId) });

export function useVersions(mappingId: number) {
  return useQuery(versionsQueryOptions(mappingId));
}
