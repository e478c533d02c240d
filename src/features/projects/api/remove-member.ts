import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { meKeys, projectKeys } from '../../../lib/query-keys';

export function removeMember(projectId: number, userId: number): Promise<void> {
  return api.delete(`/api/projects/${projectId}/members/${userId}`);
}

export function useRemoveMember(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (userId: number) => removeMember(projectId, userId),
    onSuccess: () => Promise.all([
      queryClient.invalidateQueries({ queryKey: projectKeys.all }),
      queryClient.invalidateQueries({ queryKey: meKeys.me }),
    ]),
  });
}
