import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateProjectBody, ProjectSummary } from '../../../shared/projects';
import { api } from '../../../lib/api-client';
import { meKeys, projectKeys } from '../../../lib/query-keys';

export function createProject(body: CreateProjectBody): Promise<ProjectSummary> {
  return api.post<ProjectSummary>('/api/projects', body);
}

export function useCreateProject() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createProject,
    // The creator becomes its supervisor, so their own roles change too.
    onSuccess: () => Promise.all([
      queryClient.invalidateQueries({ queryKey: projectKeys.all }),
      queryClient.invalidateQueries({ queryKey: meKeys.me }),
    ]),
  });
}
