import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ProjectSummary } from '../../../shared/projects';
import { api } from '../../../lib/api-client';
import { projectKeys } from '../../../lib/query-keys';

export function getProjects(): Promise<ProjectSummary[]> {
  return api.get<ProjectSummary[]>('/api/projects');
}

export const projectsQueryOptions = () => queryOptions({ queryKey: projectKeys.list(), queryFn: getProjects });

export function useProjects() {
  return useQuery(projectsQueryOptions());
}
