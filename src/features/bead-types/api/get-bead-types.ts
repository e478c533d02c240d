import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BeadTypeLibrary } from '../../../shared/bead-types';
import { api } from '../../../lib/api-client';
import { beadTypeKeys } from '../../../lib/query-keys';

export const getBeadTypes = (projectId: number) => api.get<BeadTypeLibrary>(`/api/projects/${projectId}/bead-types`);

export const beadTypesQueryOptions = (projectId: number) =>
  queryOptions({ queryKey: beadTypeKeys.library(projectId), queryFn: () => getBeadTypes(projectId) });

export function useBeadTypes(projectId: number, enabled = true) {
  return useQuery({ ...beadTypesQueryOptions(projectId), enabled });
}

/** Where the browser downloads the library as CSV (the server names the file). */
export const beadTypesCsvUrl = (projectId: number) => `/api/projects/${projectId}/bead-types?format=csv`;
