import { useEffect } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { ThreadEvent } from '../../../shared/threads';
import { threadsQueryOptions, upsertThread } from '../api/get-threads';
import { threadKeys } from '../../../lib/query-keys';

/**
 * Keeps the mapping's thread cache live from its server-sent event stream: every pushed thread goes
 * into the cache; on every (re)connection the list is refetched, so nothing missed while away is lost.
 */
export function useThreadEvents(mappingId: number): void {
  const queryClient = useQueryClient();
  useEffect(() => {
    const source = new EventSource(`/api/mappings/${mappingId}/events`);
    source.addEventListener('open', () => void queryClient.invalidateQueries({ queryKey: threadsQueryOptions(mappingId).queryKey }));
    source.addEventListener('thread', (e) => {
      upsertThread(queryClient, (JSON.parse((e as MessageEvent<string>).data) as ThreadEvent).thread);
      // Lists of a version's threads (longer keys under the same prefix) refetch.
      void queryClient.invalidateQueries({ queryKey: threadsQueryOptions(mappingId).queryKey, predicate: (q) => threadKeys.isVersionList(q.queryKey) });
    });
    return () => source.close();
  }, [mappingId, queryClient]);
}
