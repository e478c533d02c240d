import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AnalysisView } from '../../../shared/references';
import { api } from '../../../lib/api-client';
import { referenceKeys } from '../../../lib/query-keys';

const running = (a: AnalysisView) => a.status === 'queued' || a.status === 'running';

export const analysesQueryOptions = (mappingId: number) =>
  queryOptions({
    queryKey: referenceKeys.analysesOf(mappingId),
    queryFn: () => api.get<AnalysisView[]>(`/api/mappings/${mappingId}/analyses`),
    // Progress lives in MariaDB: every viewer polls it once a second while something runs.
    refetchInterval: (q) => (q.state.data?.some(running) ? 1000 : false),
  });

export function useAnalyses(mappingId: number | null) {
  return useQuery({ ...analysesQueryOptions(mappingId ?? 0), enabled: mappingId !== null });
}

export const analysisQueryOptions = (analysisId: number) =>
  queryOptions({
    queryKey: referenceKeys.analysis(analysisId),
    queryFn: () => api.get<AnalysisView>(`/api/analyses/${analysisId}`),
    refetchInterval: (q) => (q.state.data && running(q.state.data) ? 1000 : false),
  });

export function useAnalysis(analysisId: number | null) {
  return useQuery({ ...analysisQueryOptions(analysisId ?? 0), enabled: analysisId !== null });
}
