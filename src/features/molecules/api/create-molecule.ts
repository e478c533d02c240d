import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateMoleculeBody, MoleculeSummary } from '../../../shared/molecules';
import { api } from '../../../lib/api-client';
import { projectKeys } from '../../../lib/query-keys';

export const createMolecule = (projectId: number, body: CreateMoleculeBody) => api.post<MoleculeSummary>(`/api/projects/${projectId}/molecules`, body);

export function useCreateMolecule(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateMoleculeBody) => createMolecule(projectId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: projectKeys.detail(projectId) }),
  });
}
