import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ProjectSummary } from '../../../shared/projects';
import { api } from '../../../lib/api-client';

export function getProjects(): Promise<ProjectSummary[]> {
  return api.get<ProjectSummary[]>('/api/projects');
}

/** Every project query key starts with ['projects'], so one invalidation refreshes them all. */
export const projectsQueryOptions = () => queryOptions({ queryKey: ['projects'], queryFn: getProjects });

export function useProjects() {
  return useQuery(projectsQueryOptions());
}
