import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateMappingBody, MappingDetail } from '../../../shared/mappings';
import type { TransferReport } from '../../../shared/proposals';
import { api } from '../../../lib/api-client';
import { mappingsQueryOptions } from './get-mappings';

export const createMapping = (moleculeId: number, body: CreateMappingBody) => api.post<MappingDetail & { transfer?: TransferReport }>(`/api/molecules/${moleculeId}/mappings`, body);

export function useCreateMapping(moleculeId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateMappingBody) => createMapping(moleculeId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: mappingsQueryOptions(moleculeId).queryKey }),
  });
}
