import { queryOptions, useQuery, keepPreviousData } from '@tanstack/react-query';
import type { MoleculeSummary } from '../../../shared/molecules';
import { api } from '../../../lib/api-client';
import { moleculeKeys } from '../../../lib/query-keys';

export function getMolecules(projectId: number, q: string): Promise<MoleculeSummary[]> {
  const query = q.trim() ? `?q=${encodeURIComponent(q.trim())}` : '';
  return api.get<MoleculeSummary[]>(`/api/projects/${projectId}/molecules${query}`);
}

/** Every search shares the moleculeKeys.ofProject prefix, so invalidating it refreshes them all. */
export const moleculesQueryOptions = (projectId: number, q = '') =>
  queryOptions({ queryKey: moleculeKeys.search(projectId, q.trim()), queryFn: () => getMolecules(projectId, q), placeholderData: keepPreviousData });

export function useMolecules(projectId: number, q = '') {
  return useQuery(moleculesQueryOptions(projectId, q));
}
