import { queryOptions, useQuery, type QueryClient } from '@tanstack/react-query';
import type { Thread } from '../../../shared/threads';
import { api } from '../../../lib/api-client';
import { threadKeys } from '../../../lib/query-keys';

export function getThreads(mappingId: number): Promise<Thread[]> {
  return api.get<Thread[]>(`/api/mappings/${mappingId}/threads`);
}

export const threadsQueryOptions = (mappingId: number) => queryOptions({ queryKey: threadKeys.list(mappingId), queryFn: () => getThreads(mappingId) });

/** Every thread of a mapping (open and resolved); the panel filters. */
export function useThreads(mappingId: number) {
  return useQuery(threadsQueryOptions(mappingId));
}

/** Puts one thread, as the server answered or pushed it, into the mapping's cached list. */
export function upsertThread(queryClient: QueryClient, thread: Thread): void {
  queryClient.setQueryData(threadsQueryOptions(thread.mappingId).queryKey, (list) => {
    if (!list) return list;
    const at = list.findIndex((t) => t.id === thread.id);
    return at < 0 ? [...list, thread] : list.map((t) => (t.id === thread.id ? thread : t));
  });
}

/** The threads on the beads a saved version contains (GET …/threads?version=N). */
export const versionThreadsQueryOptions = (mappingId: number, version: number) =>
  queryOptions({ queryKey: threadKeys.ofVersion(mappingId, version), queryFn: () => api.get<Thread[]>(`/api/mappings/${mappingId}/threads?version=${version}`) });

export function useVersionThreads(mappingId: number, version: number) {
  return useQuery(versionThreadsQueryOptions(mappingId, version));
}
