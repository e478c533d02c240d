import { queryOptions, useQuery, keepPreviousData } from '@tanstack/react-query';
import type { MoleculeSummary } from '../../../shared/molecules';
import { api } from '../../../lib/api-client';

export function getMolecules(projectId: number, q: string): Promise<MoleculeSummary[]> {
  const query = q.trim() ? `?q=${encodeURIComponent(q.trim())}` : '';
  return api.get<MoleculeSummary[]>(`/api/projects/${projectId}/molecules${query}`);
}

/** Shares the ['projects', id, 'molecules'] prefix, so invalidating it refreshes every search. */
export const moleculesQueryOptions = (projectId: number, q = '') =>
  queryOptions({ queryKey: ['projects', projectId, 'molecules', { q: q.trim() }], queryFn: () => getMolecules(projectId, q), placeholderData: keepPreviousData });

export function useMolecules(projectId: number, q = '') {
  return useQuery(moleculesQueryOptions(projectId, q));
}
