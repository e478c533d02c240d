import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { referenceKeys } from '../../../lib/query-keys';
import type { ReferenceSelection } from '../../../shared/references-selection';

/** A failed reference whose files were kept, matched again with another selection (null: the whole system). */
export const matchReferenceAgain = (id: number, selection: ReferenceSelection | null) => api.post(`/api/references/${id}/match`, { selection });

export function useMatchReferenceAgain(moleculeId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, selection }: { id: number; selection: ReferenceSelection | null }) => matchReferenceAgain(id, selection),
    onSettled: () => queryClient.invalidateQueries({ queryKey: referenceKeys.ofMolecule(moleculeId) }),
  });
}
