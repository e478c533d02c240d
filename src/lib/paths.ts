// Every client route in one place, so links and the router cannot drift apart.
export const paths = {
  signIn: '/sign-in',
  forgotPassword: '/forgot-password',
  resetPassword: '/reset-password',
  projects: '/projects',
  project: (projectId: number | string) => `/projects/${projectId}`,
  newMolecule: (projectId: number | string) => `/projects/${projectId}/molecules/new`,
  molecule: (moleculeId: number | string) => `/molecules/${moleculeId}`,
  mapping: (mappingId: number | string) => `/mappings/${mappingId}`,
  adminUsers: '/admin/users',
  account: '/account',
} as const;

/** Where to go after signing in: only same-site paths, never another origin. */
export function safeNext(next: string | null): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith(paths.signIn)) return paths.projects;
  return next;
}
