// Every TanStack Query key of the client, one factory per area. Queries, invalidations and cache
// writes all build their keys here, so a key cannot drift between the query that fills the cache
// and the mutation that refreshes it.
//
// The keys nest on purpose: invalidating a prefix refreshes everything under it.
//   ['projects', id, …]   the project, its members, molecule searches and bead type library
//   ['molecules', id, …]  the molecule and its mapping list
//   ['mappings', id, …]   the mapping, its versions, lock, audit trail, comparisons and threads

type Key = readonly unknown[];

export const meKeys = {
  /** The signed-in person (GET /api/me): roles and flags change when memberships do. */
  me: ['me'] as const,
  preferences: () => [...meKeys.me, 'preferences'] as const,
};

export const projectKeys = {
  /** Prefix of every project key: one invalidation refreshes lists, details and what hangs under them. */
  all: ['projects'] as const,
  list: () => [...projectKeys.all, 'list'] as const,
  detail: (projectId: number) => [...projectKeys.all, projectId] as const,
  members: (projectId: number) => [...projectKeys.detail(projectId), 'members'] as const,
  mentionCandidates: (projectId: number) => [...projectKeys.members(projectId), 'mentions'] as const,
};

export const moleculeKeys = {
  /** Prefix of every molecule and of every molecule's mapping list. */
  all: ['molecules'] as const,
  /** Prefix of every search of a project's molecules. */
  ofProject: (projectId: number) => [...projectKeys.detail(projectId), 'molecules'] as const,
  search: (projectId: number, q: string) => [...moleculeKeys.ofProject(projectId), { q }] as const,
  detail: (moleculeId: number) => [...moleculeKeys.all, moleculeId] as const,
};

export const beadTypeKeys = {
  library: (projectId: number) => [...projectKeys.detail(projectId), 'bead-types'] as const,
};

export const mappingKeys = {
  /** The mapping and, as a prefix, its whole history and threads. */
  detail: (mappingId: number) => ['mappings', mappingId] as const,
  ofMolecule: (moleculeId: number) => [...moleculeKeys.detail(moleculeId), 'mappings'] as const,
  ofProject: (projectId: number) => [...projectKeys.detail(projectId), 'mappings'] as const,
};

export type StateRef = number | 'draft';

export const versionKeys = {
  list: (mappingId: number) => [...mappingKeys.detail(mappingId), 'versions'] as const,
  detail: (mappingId: number, n: number) => [...versionKeys.list(mappingId), n] as const,
  compare: (mappingId: number, from: StateRef, to: StateRef) => [...mappingKeys.detail(mappingId), 'compare', from, to] as const,
  lock: (mappingId: number) => [...mappingKeys.detail(mappingId), 'lock'] as const,
  audit: (mappingId: number) => [...mappingKeys.detail(mappingId), 'audit'] as const,
};

export const threadKeys = {
  /** Every thread of a mapping; also the prefix of the per-version lists. */
  list: (mappingId: number) => [...mappingKeys.detail(mappingId), 'threads'] as const,
  ofVersion: (mappingId: number, version: number) => [...threadKeys.list(mappingId), { version }] as const,
  /** Whether a key is one of the per-version lists (longer than the mapping's own list key). */
  isVersionList: (key: Key) => key.length > threadKeys.list(0).length,
};

export const referenceKeys = {
  ofMolecule: (moleculeId: number) => [...moleculeKeys.detail(moleculeId), 'references'] as const,
  analysesOf: (mappingId: number) => [...mappingKeys.detail(mappingId), 'analyses'] as const,
  analysis: (analysisId: number) => ['analyses', analysisId] as const,
};

export const notificationKeys = {
  list: () => ['notifications'] as const,
};

export const userKeys = {
  list: () => ['users'] as const,
};
