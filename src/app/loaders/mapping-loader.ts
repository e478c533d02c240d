import type { LoaderFunctionArgs } from 'react-router';
import type { MappingSummary } from '../../shared/mappings';
import { moleculeKeys } from '../../lib/query-keys';
import { mappingQueryOptions } from '../../features/mappings/api/get-mapping';
import { moleculeQueryOptions } from '../../features/molecules/api/get-molecule';
import { beadTypesQueryOptions } from '../../features/bead-types/api/get-bead-types';
import { projectQueryOptions } from '../../features/projects/api/get-project';
import { threadsQueryOptions } from '../../features/threads/api/get-threads';
import { versionsQueryOptions } from '../../features/versions/api/get-versions';
import { lockQueryOptions } from '../../features/versions/api/get-lock';
import { queryClient } from '../provider';
import { fill, idParam } from './route-data';

// The editor's data. The molecule and the bead type library are found through the mapping
// (its moleculeId and projectId). Coming from the molecule page, the cached mapping list already
// names both, so mapping, molecule, library and project are asked for at once; on a cold link the
// mapping goes first and the other three follow together. The reads keyed by the mapping id alone
// (threads, versions, lock) start with the mapping, and all of it while the editor's code loads.

/** The molecule and project of a mapping, when a cached mapping list already says them. */
function knownParents(mappingId: number): Pick<MappingSummary, 'moleculeId' | 'projectId'> | undefined {
  // Under the molecule keys, the arrays are the mapping lists (the rest are molecules).
  for (const [, list] of queryClient.getQueriesData<unknown>({ queryKey: moleculeKeys.all })) {
    const hit = Array.isArray(list) ? (list as MappingSummary[]).find((m) => m.id === mappingId) : undefined;
    if (hit) return hit;
  }
  return undefined;
}

function parents({ moleculeId, projectId }: Pick<MappingSummary, 'moleculeId' | 'projectId'>) {
  return Promise.all([
    queryClient.ensureQueryData(moleculeQueryOptions(moleculeId)),
    queryClient.ensureQueryData(beadTypesQueryOptions(projectId)),
    queryClient.prefetchQuery(projectQueryOptions(projectId)),
  ]);
}

export async function mappingLoader({ request, params }: LoaderFunctionArgs) {
  const mappingId = idParam(params.mappingId);
  await fill(request, async () => {
    const side = Promise.all([
      queryClient.prefetchQuery(threadsQueryOptions(mappingId)),
      queryClient.prefetchQuery(versionsQueryOptions(mappingId)),
      queryClient.prefetchQuery(lockQueryOptions(mappingId)),
    ]);
    const known = knownParents(mappingId);
    const early = known ? parents(known) : undefined;
    // Awaited below when the guess holds; when it does not, its failure does not matter.
    early?.catch(() => undefined);
    const mapping = await queryClient.ensureQueryData(mappingQueryOptions(mappingId));
    // A cached list may be out of date (a mapping never changes molecule, but be sure).
    const sameParents = known && known.moleculeId === mapping.moleculeId && known.projectId === mapping.projectId;
    await Promise.all([sameParents ? early : parents(mapping), side]);
  });
  return { mappingId };
}
