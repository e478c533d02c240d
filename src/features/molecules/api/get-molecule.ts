import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MoleculeDetail } from '../../../shared/molecules';
import { api } from '../../../lib/api-client';
import { moleculeKeys } from '../../../lib/query-keys';

export const getMolecule = (moleculeId: number) => api.get<MoleculeDetail>(`/api/molecules/${moleculeId}`);

export const moleculeQueryOptions = (moleculeId: number) =>
  queryOptions({
    queryKey: moleculeKeys.detail(moleculeId),
    queryFn: () => getMolecule(moleculeId),
    // While a conformer is being made, look again now and then so centres appear when it lands.
    refetchInterval: (q) => (['queued', 'running'].includes(q.state.data?.coordinates.status ?? '') ? 5000 : false),
  });

export function useMolecule(moleculeId: number, enabled = true) {
  return useQuery({ ...moleculeQueryOptions(moleculeId), enabled });
}
