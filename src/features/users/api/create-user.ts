import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateUserBody, UserSummary } from '../../../shared/users';
import { api } from '../../../lib/api-client';
import { usersQueryOptions } from './get-users';

/** Creates an account; the server e-mails the person a set-your-password link. */
export function createUser(body: CreateUserBody): Promise<UserSummary> {
  return api.post<UserSummary>('/api/users', body);
}

export function useCreateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createUser,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: usersQueryOptions().queryKey }),
  });
}
