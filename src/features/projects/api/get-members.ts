import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Member } from '../../../shared/projects';
import { api } from '../../../lib/api-client';
import { projectKeys } from '../../../lib/query-keys';

export function getMembers(projectId: number): Promise<Member[]> {
  return api.get<Member[]>(`/api/projects/${projectId}/members`);
}

export const membersQueryOptions = (projectId: number) =>
  queryOptions({ queryKey: projectKeys.members(projectId), queryFn: () => getMembers(projectId) });

export function useMembers(projectId: number) {
  return useQuery(membersQueryOptions(projectId));
}
