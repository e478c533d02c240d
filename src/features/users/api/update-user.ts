import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { UpdateUserBody, UserSummary } from '../../../shared/users';
import { api } from '../../../lib/api-client';
import { meKeys } from '../../../lib/query-keys';
import { usersQueryOptions } from './get-users';

/** Renames, grants or revokes admin, disables or enables; disabling ends the account's sessions. */
export function updateUser(userId: number, body: UpdateUserBody): Promise<UserSummary> {
  return api.patch<UserSummary>(`/api/users/${userId}`, body);
}

export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, ...body }: { userId: number } & UpdateUserBody) => updateUser(userId, body),
    // An admin may change their own flags.
    onSettled: () => Promise.all([
      queryClient.invalidateQueries({ queryKey: usersQueryOptions().queryKey }),
      queryClient.invalidateQueries({ queryKey: meKeys.me }),
    ]),
  });
}
