import { queryOptions, useQuery } from '@tanstack/react-query';
import type { UserSummary } from '../../../shared/users';
import { api } from '../../../lib/api-client';
import { userKeys } from '../../../lib/query-keys';

export function getUsers(): Promise<UserSummary[]> {
  return api.get<UserSummary[]>('/api/users');
}

export const usersQueryOptions = () => queryOptions({ queryKey: userKeys.list(), queryFn: getUsers });

export function useUsers() {
  return useQuery(usersQueryOptions());
}
