import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { referenceKeys } from '../../../lib/query-keys';

export const deleteReference = (id: number) => api.delete(`/api/references/${id}`);

export function useDeleteReference(moleculeId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteReference,
    onSettled: () => queryClient.invalidateQueries({ queryKey: referenceKeys.ofMolecule(moleculeId) }),
  });
}
