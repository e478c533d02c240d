import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MappingSummary } from '../../../shared/mappings';
import { api } from '../../../lib/api-client';
import { mappingKeys } from '../../../lib/query-keys';

export const getMappings = (moleculeId: number) => api.get<MappingSummary[]>(`/api/molecules/${moleculeId}/mappings`);

export const mappingsQueryOptions = (moleculeId: number) =>
  queryOptions({ queryKey: mappingKeys.ofMolecule(moleculeId), queryFn: () => getMappings(moleculeId) });

export function useMappings(moleculeId: number) {
  return useQuery(mappingsQueryOptions(moleculeId));
}
