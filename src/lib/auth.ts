import { createContext, use } from 'react';
import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Me } from '../shared/auth';
import { api } from './api-client';
import { meKeys } from './query-keys';

// Who is signed in. The shell's loader fills the cache before any signed-in page renders, and the
// shell hands the person down through CurrentUserContext, so pages and features read it without
// asking the server again.

export function getMe(): Promise<Me> {
  return api.get<Me>('/api/me');
}

export const meQueryOptions = () => queryOptions({ queryKey: meKeys.me, queryFn: getMe });

/** The signed-in person; a 401 here sends the browser to sign-in. */
export function useMe() {
  return useQuery(meQueryOptions());
}

export const CurrentUserContext = createContext<Me | null>(null);

/** The signed-in person, for anything inside the shell (which renders only once it is known). */
export function useCurrentUser(): Me {
  const me = use(CurrentUserContext);
  if (!me) throw new Error('useCurrentUser: only inside the signed-in shell');
  return me;
}
