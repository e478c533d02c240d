import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ReferenceView } from '../../../shared/references';
import { api } from '../../../lib/api-client';
import { referenceKeys } from '../../../lib/query-keys';

export const getReferences = (moleculeId: number) => api.get<ReferenceView[]>(`/api/molecules/${moleculeId}/references`);

export const referencesQueryOptions = (moleculeId: number) =>
  queryOptions({
    queryKey: referenceKeys.ofMolecule(moleculeId),
    queryFn: () => getReferences(moleculeId),
    // While a reference is being matched, look again each second so everyone sees its progress.
    refetchInterval: (q) => (q.state.data?.some((r) => r.status === 'queued' || r.status === 'matching') ? 1000 : false),
  });

export function useReferences(moleculeId: number) {
  return useQuery(referencesQueryOptions(moleculeId));
}
