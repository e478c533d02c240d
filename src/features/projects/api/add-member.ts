import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AddMemberBody, Member } from '../../../shared/projects';
import { api } from '../../../lib/api-client';
import { projectKeys } from '../../../lib/query-keys';

/** Adds a member by e-mail; an unknown address gets an account and an invitation. */
export function addMember(projectId: number, body: AddMemberBody): Promise<Member> {
  return api.post<Member>(`/api/projects/${projectId}/members`, body);
}

export function useAddMember(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: AddMemberBody) => addMember(projectId, body),
    // The project key is a prefix of its members key: both refresh (the count too).
    onSuccess: () => queryClient.invalidateQueries({ queryKey: projectKeys.detail(projectId) }),
  });
}
