import type { Me } from '../shared/auth';
import { can, canSite, type ProjectAction, type ProjectStanding, type SiteAction, type SiteStanding } from '../shared/permissions';
import { useCurrentUser } from './auth';

// The client's side of the one permission rule table (src/shared/permissions.ts): the server
// enforces it on every request; here it only decides what to show. The caller's role in a project
// comes from GET /api/me (refreshed whenever memberships change), so no page needs the project
// itself to know what its reader may do.

export const projectStanding = (me: Me, projectId: number): ProjectStanding => ({
  isAdmin: me.isAdmin,
  role: me.projects.find((p) => p.projectId === projectId)?.role ?? null,
});

export const siteStanding = (me: Me): SiteStanding => ({ isAdmin: me.isAdmin, roles: me.projects.map((p) => p.role) });

/** Whether the signed-in person may do `action` in project `projectId`. */
export function useCan(action: ProjectAction, projectId: number): boolean {
  return can(projectStanding(useCurrentUser(), projectId), action);
}

/** Whether the signed-in person may do a site-wide `action` (manage accounts, create projects …). */
export function useCanSite(action: SiteAction): boolean {
  return canSite(siteStanding(useCurrentUser()), action);
}
