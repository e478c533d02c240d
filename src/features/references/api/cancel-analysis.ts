import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { referenceKeys } from '../../../lib/query-keys';

/** Cancels a running analysis, or removes a finished one. */
export const cancelAnalysis = (id: number) => api.delete(`/api/analyses/${id}`);

export function useCancelAnalysis(mappingId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: cancelAnalysis,
    onSettled: () => queryClient.invalidateQueries({ queryKey: referenceKeys.analysesOf(mappingId) }),
  });
}
