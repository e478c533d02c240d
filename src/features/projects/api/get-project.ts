import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ProjectSummary } from '../../../shared/projects';
import { api } from '../../../lib/api-client';
import { projectKeys } from '../../../lib/query-keys';

export function getProject(projectId: number): Promise<ProjectSummary> {
  return api.get<ProjectSummary>(`/api/projects/${projectId}`);
}

export const projectQueryOptions = (projectId: number) =>
  queryOptions({ queryKey: projectKeys.detail(projectId), queryFn: () => getProject(projectId) });

/** Asks only for a real id: a page that learns its project from another request passes 0 until then. */
export function useProject(projectId: number) {
  return useQuery({ ...projectQueryOptions(projectId), enabled: projectId > 0 });
}
