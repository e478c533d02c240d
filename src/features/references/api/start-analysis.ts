import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AnalysisBody } from '../../../shared/references';
import { api } from '../../../lib/api-client';
import { referenceKeys } from '../../../lib/query-keys';

export const startAnalysis = (mappingId: number, body: AnalysisBody) => api.post<void>(`/api/mappings/${mappingId}/analyses`, body);

export function useStartAnalysis(mappingId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: AnalysisBody) => startAnalysis(mappingId, body),
    onSettled: () => queryClient.invalidateQueries({ queryKey: referenceKeys.analysesOf(mappingId) }),
  });
}
