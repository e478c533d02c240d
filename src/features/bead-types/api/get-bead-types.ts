import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BeadTypeLibrary } from '../../../shared/bead-types';
import { api } from '../../../lib/api-client';

export const getBeadTypes = (projectId: number) => api.get<BeadTypeLibrary>(`/api/projects/${projectId}/bead-types`);

export const beadTypesQueryOptions = (projectId: number) =>
  queryOptions({ queryKey: ['projects', projectId, 'bead-types'], queryFn: () => getBeadTypes(projectId) });

export function useBeadTypes(projectId: number, enabled = true) {
  return useQuery({ ...beadTypesQueryOptions(projectId), enabled });
}

/** Where the browser downloads the library as CSV (the server names the file). */
export const beadTypesCsvUrl = (projectId: number) => `/api/projects/${projectId}/bead-types?format=csv`;
