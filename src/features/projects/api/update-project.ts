import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ProjectSummary, UpdateProjectBody } from '../../../shared/projects';
import { api } from '../../../lib/api-client';
import { projectKeys } from '../../../lib/query-keys';

export function updateProject(projectId: number, body: UpdateProjectBody): Promise<ProjectSummary> {
  return api.patch<ProjectSummary>(`/api/projects/${projectId}`, body);
}

export function useUpdateProject(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdateProjectBody) => updateProject(projectId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: projectKeys.all }),
  });
}
