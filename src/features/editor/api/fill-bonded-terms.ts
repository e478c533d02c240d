import { useMutation, useQuery } from '@tanstack/react-query';
import type { AnalysisView } from '../../../shared/references';
import type { BondedFillView } from '../../../shared/bonded-fill';
import { api } from '../../../lib/api-client';
import { referenceKeys } from '../../../lib/query-keys';

// Filling the bonded terms from an analysis (the list of finished ones: src/hooks/use-finished-analyses.ts):
// one analysis with its result (to say before a fill what it replaces) and the PUT. The draft changes arrive over the live socket; nothing to invalidate.

export function useAnalysisResult(analysisId: number | null) {
  return useQuery({
    queryKey: referenceKeys.analysis(analysisId ?? 0),
    queryFn: () => api.get<AnalysisView>(`/api/analyses/${analysisId}`),
    enabled: analysisId !== null,
  });
}

export const fillBondedTerms = (mappingId: number, analysisId: number) => api.put<BondedFillView>(`/api/mappings/${mappingId}/bonded-terms`, { fromAnalysis: analysisId });

export function useFillBondedTerms(mappingId: number) {
  return useMutation({ mutationFn: (analysisId: number) => fillBondedTerms(mappingId, analysisId) });
}
