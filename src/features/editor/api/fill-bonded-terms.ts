import { queryOptions, useMutation, useQuery } from '@tanstack/react-query';
import type { AnalysisView } from '../../../shared/references';
import type { BondedFillView } from '../../../shared/bonded-fill';
import { api } from '../../../lib/api-client';
import { referenceKeys } from '../../../lib/query-keys';

// Filling the bonded terms from an analysis: the mapping's analyses (the same list and key the
// references feature reads, so both share the cache), one analysis with its result (to say before a
// fill what it replaces) and the PUT. The draft changes arrive over the live socket; nothing to invalidate.

const finishedAnalysesOptions = (mappingId: number) =>
  queryOptions({
    queryKey: referenceKeys.analysesOf(mappingId),
    queryFn: () => api.get<AnalysisView[]>(`/api/mappings/${mappingId}/analyses`),
  });

export function useFinishedAnalyses(mappingId: number) {
  return useQuery({ ...finishedAnalysesOptions(mappingId), select: (list) => list.filter((a) => a.status === 'done') });
}

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
