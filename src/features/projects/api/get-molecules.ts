import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

// TODO(shared): replace with the shared MoleculeSummary once src/shared has it.
export interface MoleculeSummary {
  id: number;
  name: string;
  smiles: string;
  createdAt: string;
}

export function getMolecules(projectId: number): Promise<MoleculeSummary[]> {
  return api.get<MoleculeSummary[]>(`/api/projects/${projectId}/molecules`);
}

export const moleculesQueryOptions = (projectId: number) =>
  queryOptions({ queryKey: ['projects', projectId, 'molecules'], queryFn: () => getMolecules(projectId) });

export function useMolecules(projectId: number) {
  return useQuery(moleculesQueryOptions(projectId));
}
