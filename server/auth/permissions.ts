import type { ProjectRole } from '../../src/shared/roles';

// The whole permission matrix of Beadloom, as data. Every HTTP route and the
// collaboration socket ask `can()`; nothing else decides who may do what.
//
// Site-wide: `admin` may do everything. Within a project a member has one role.
// Someone who is not a member (and not an admin) may do nothing in that project,
// and is answered 404 rather than 403 so that project names do not leak.

export type ProjectAction =
  | 'project:read'
  | 'project:update'
  | 'members:read'
  | 'members:manage'
  | 'molecule:read'
  | 'molecule:create'
  | 'molecule:update'
  | 'molecule:delete'
  | 'mapping:read'
  | 'mapping:create'
  | 'mapping:edit'
  | 'mapping:export'
  | 'version:save'
  | 'version:restore'
  | 'mapping:lock'
  | 'library:read'
  | 'library:edit'
  | 'thread:read'
  | 'comment:create'
  | 'comment:moderate';

export type SiteAction = 'users:manage' | 'project:create' | 'chem:use' | 'mail:read';

const EVERYONE: readonly ProjectRole[] = ['supervisor', 'modeller', 'student'];
const EDITORS: readonly ProjectRole[] = ['supervisor', 'modeller'];
const SUPERVISORS: readonly ProjectRole[] = ['supervisor'];

export const PROJECT_MATRIX: Readonly<Record<ProjectAction, readonly ProjectRole[]>> = {
  'project:read': EVERYONE,
  'project:update': SUPERVISORS,
  'members:read': EVERYONE,
  'members:manage': SUPERVISORS,
  'molecule:read': EVERYONE,
  'molecule:create': EDITORS,
  'molecule:update': EDITORS,
  'molecule:delete': EDITORS,
  'mapping:read': EVERYONE,
  'mapping:create': EDITORS,
  'mapping:edit': EDITORS,
  'mapping:export': EVERYONE,
  'version:save': EDITORS,
  'version:restore': EDITORS,
  'mapping:lock': SUPERVISORS,
  'library:read': EVERYONE,
  'library:edit': EDITORS,
  'thread:read': EVERYONE,
  'comment:create': EVERYONE,
  'comment:moderate': SUPERVISORS,
};

export interface Actor {
  id: number;
  isAdmin: boolean;
}

/** What the actor is in one project: their role, or null when not a member. */
export interface ProjectStanding {
  role: ProjectRole | null;
}

export function can(actor: Actor | null | undefined, action: ProjectAction, project: ProjectStanding): boolean {
  if (!actor) return false;
  if (actor.isAdmin) return true;
  return project.role !== null && PROJECT_MATRIX[action].includes(project.role);
}

/** Whether the project is visible at all; invisible projects answer 404. */
export function canSee(actor: Actor | null | undefined, project: ProjectStanding): boolean {
  return !!actor && (actor.isAdmin || project.role !== null);
}

export interface SiteStanding {
  /** Roles the actor holds across all projects. */
  roles: readonly ProjectRole[];
}

export function canSite(actor: Actor | null | undefined, action: SiteAction, site: SiteStanding): boolean {
  if (!actor) return false;
  if (actor.isAdmin) return true;
  switch (action) {
    case 'users:manage':
    case 'mail:read': // the local mail sink holds every account's reset links
      return false;
    case 'project:create':
      return site.roles.includes('supervisor');
    case 'chem:use':
      return true;
  }
}
