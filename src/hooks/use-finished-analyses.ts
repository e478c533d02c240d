import { useQuery } from '@tanstack/react-query';
import type { AnalysisView } from '../shared/references';
import { api } from '../lib/api-client';
import { referenceKeys } from '../lib/query-keys';

/**
 * The finished analyses of a mapping (newest first), for the features that build on one: filling the
 * bonded terms and exporting at an analysis's mean structure. Same list and key as the references
 * feature's, so they share the cache.
 */
export function useFinishedAnalyses(mappingId: number) {
  return useQuery({
    queryKey: referenceKeys.analysesOf(mappingId),
    queryFn: () => api.get<AnalysisView[]>(`/api/mappings/${mappingId}/analyses`),
    select: (list) => list.filter((a) => a.status === 'done'),
  });
}

/** How a finished analysis is named in pickers: its id, the state it applied and its temperature. */
export const analysisLabel = (a: AnalysisView) => `Analysis ${a.id} · ${a.versionNumber === null ? 'draft' : `version ${a.versionNumber}`} · ${a.temperature} K`;
