import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BeadTypeLibrary, ImportBeadTypesCsvBody, PutBeadTypesBody } from '../../../shared/bead-types';
import { api } from '../../../lib/api-client';
import { beadTypesQueryOptions } from './get-bead-types';

/** Replaces the whole library, from rows or from CSV text. */
export const putBeadTypes = (projectId: number, body: PutBeadTypesBody | ImportBeadTypesCsvBody) => api.put<BeadTypeLibrary>(`/api/projects/${projectId}/bead-types`, body);

export function usePutBeadTypes(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: PutBeadTypesBody | ImportBeadTypesCsvBody) => putBeadTypes(projectId, body),
    onSuccess: (library) => queryClient.setQueryData(beadTypesQueryOptions(projectId).queryKey, library),
  });
}
