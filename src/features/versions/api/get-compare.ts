import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Comparison } from '../../../shared/versions';
import { api } from '../../../lib/api-client';
import { versionKeys, type StateRef } from '../../../lib/query-keys';

export type { StateRef };

export const getCompare = (mappingId: number, from: StateRef, to: StateRef) => api.get<Comparison>(`/api/mappings/${mappingId}/compare?from=${from}&to=${to}`);

export const compareQueryOptions = (mappingId: number, from: StateRef, to: StateRef) =>
  queryOptions({ queryKey: versionKeys.compare(mappingId, from, to), queryFn: () => getCompare(mappingId, from, to) });

export function useCompare(mappingId: number, from: StateRef, to: StateRef) {
  return useQuery(compareQueryOptions(mappingId, from, to));
}
