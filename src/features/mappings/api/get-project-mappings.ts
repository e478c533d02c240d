import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ProjectMappingSummary } from '../../../shared/mappings';
import { api } from '../../../lib/api-client';
import { mappingKeys } from '../../../lib/query-keys';

export const getProjectMappings = (projectId: number) => api.get<ProjectMappingSummary[]>(`/api/projects/${projectId}/mappings`);

export const projectMappingsQueryOptions = (projectId: number) =>
  queryOptions({ queryKey: mappingKeys.ofProject(projectId), queryFn: () => getProjectMappings(projectId) });

/** Every mapping of the project, with its molecule's name (transfer sources for a new mapping). */
export function useProjectMappings(projectId: number) {
  return useQuery(projectMappingsQueryOptions(projectId));
}
