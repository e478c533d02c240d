import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MappingDetail } from '../../../shared/mappings';
import { api } from '../../../lib/api-client';
import { mappingKeys } from '../../../lib/query-keys';

export const getMapping = (mappingId: number) => api.get<MappingDetail>(`/api/mappings/${mappingId}`);

export const mappingQueryOptions = (mappingId: number) =>
  queryOptions({ queryKey: mappingKeys.detail(mappingId), queryFn: () => getMapping(mappingId), refetchOnWindowFocus: false });

export function useMapping(mappingId: number) {
  return useQuery(mappingQueryOptions(mappingId));
}
