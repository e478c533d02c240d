import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ChangeRoleBody, Member } from '../../../shared/projects';
import { api } from '../../../lib/api-client';
import { meKeys, projectKeys } from '../../../lib/query-keys';

export function changeMemberRole(projectId: number, userId: number, body: ChangeRoleBody): Promise<Member> {
  return api.patch<Member>(`/api/projects/${projectId}/members/${userId}`, body);
}

export function useChangeMemberRole(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, role }: { userId: number } & ChangeRoleBody) => changeMemberRole(projectId, userId, { role }),
    // One's own role may be the one that changed: refresh the projects and who we are.
    onSettled: () => Promise.all([
      queryClient.invalidateQueries({ queryKey: projectKeys.all }),
      queryClient.invalidateQueries({ queryKey: meKeys.me }),
    ]),
  });
}
