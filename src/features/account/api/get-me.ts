import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Me } from '../../../shared/auth';
import { api } from '../../../lib/api-client';
import { meKeys } from '../../../lib/query-keys';

export function getMe(): Promise<Me> {
  return api.get<Me>('/api/me');
}

export const meQueryOptions = () => queryOptions({ queryKey: meKeys.me, queryFn: getMe });

/** The signed-in person; a 401 here sends the browser to sign-in. */
export function useMe() {
  return useQuery(meQueryOptions());
}
