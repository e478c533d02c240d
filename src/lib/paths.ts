import { generatePath } from 'react-router';

// Every client route in one place: the router registers these patterns and links build their URLs
// from the same patterns, so the two cannot drift apart. `generatePath` types the parameters from
// the pattern ('/projects/:projectId' wants { projectId }).
export const routePatterns = {
  signIn: '/sign-in',
  forgotPassword: '/forgot-password',
  resetPassword: '/reset-password',
  projects: '/projects',
  project: '/projects/:projectId',
  newMolecule: '/projects/:projectId/molecules/new',
  molecule: '/molecules/:moleculeId',
  mapping: '/mappings/:mappingId',
  adminUsers: '/admin/users',
  account: '/account',
} as const;

type Id = number | string;
const withSearch = (path: string, search?: Record<string, string>) => (search ? `${path}?${new URLSearchParams(search)}` : path);

export const paths = {
  signIn: routePatterns.signIn,
  /** Sign-in that comes back to `next` (a same-site path) afterwards. */
  signInThenBack: (next: string) => withSearch(routePatterns.signIn, { next }),
  /** Sign-in saying the new password is set. */
  signInPasswordSet: withSearch(routePatterns.signIn, { password: 'set' }),
  forgotPassword: routePatterns.forgotPassword,
  resetPassword: routePatterns.resetPassword,
  projects: routePatterns.projects,
  project: (projectId: Id) => generatePath(routePatterns.project, { projectId: String(projectId) }),
  newMolecule: (projectId: Id) => generatePath(routePatterns.newMolecule, { projectId: String(projectId) }),
  molecule: (moleculeId: Id) => generatePath(routePatterns.molecule, { moleculeId: String(moleculeId) }),
  /**
   * The editor; `bead` and `thread` open that bead's thread panel (deep links from mail and the bell);
   * `beads` (ids, comma-separated) rings those beads' atoms and marks them in the bead graph.
   */
  mapping: (mappingId: Id, search?: { bead: string; thread?: string } | { beads: string }) =>
    withSearch(generatePath(routePatterns.mapping, { mappingId: String(mappingId) }), search),
  adminUsers: routePatterns.adminUsers,
  account: routePatterns.account,
} as const;

/** Where to go after signing in: only same-site paths, never another origin. */
export function safeNext(next: string | null): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith(paths.signIn)) return paths.projects;
  return next;
}
