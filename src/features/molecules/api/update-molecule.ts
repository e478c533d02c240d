import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { DeleteMoleculeResponse, MoleculeSummary, UpdateMoleculeBody } from '../../../shared/molecules';
import { api } from '../../../lib/api-client';
import { moleculeQueryOptions } from './get-molecule';
import { projectKeys } from '../../../lib/query-keys';

export const updateMolecule = (moleculeId: number, body: UpdateMoleculeBody) => api.patch<MoleculeSummary>(`/api/molecules/${moleculeId}`, body);
/** Resolves to undefined when the molecule was deleted, or to the archived molecule when it was kept. */
export const deleteMolecule = (moleculeId: number) => api.delete<DeleteMoleculeResponse | undefined>(`/api/molecules/${moleculeId}`);

export function useUpdateMolecule(projectId: number, moleculeId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdateMoleculeBody) => updateMolecule(moleculeId, body),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: moleculeQueryOptions(moleculeId).queryKey }),
        queryClient.invalidateQueries({ queryKey: projectKeys.detail(projectId) }),
      ]),
  });
}

export function useDeleteMolecule(projectId: number, moleculeId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => deleteMolecule(moleculeId),
    onSuccess: (archived) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: projectKeys.detail(projectId) }),
        archived ? queryClient.invalidateQueries({ queryKey: moleculeQueryOptions(moleculeId).queryKey }) : undefined,
      ]),
  });
}
