import type { ProjectRole } from './roles';

// The whole permission rule table of Beadloom, as data, shared by both sides: every HTTP route and
// the collaboration socket ask it on the server (server/auth/access.ts), and the client asks the
// same table to decide what to show (its useCan hook). Pure: no I/O, no React, no Express.
//
// A site admin may do everything. Within a project a member has one role. Someone who is not a
// member (and not an admin) may do nothing in that project, and is answered 404 rather than 403 so
// that project names do not leak.

export const PROJECT_ACTIONS = [
  'project:read',
  'project:update',
  'members:read',
  'members:manage',
  'molecule:read',
  'molecule:create',
  'molecule:update',
  'molecule:delete',
  'mapping:read',
  'mapping:create',
  'mapping:edit',
  'mapping:propose',
  'mapping:export',
  'version:save',
  'version:restore',
  'mapping:lock',
  'library:read',
  'library:edit',
  'thread:read',
  'comment:create',
  'comment:moderate',
  'reference:read',
  'reference:create',
  'reference:delete',
  'analysis:start',
  'analysis:manage',
] as const;
export type ProjectAction = (typeof PROJECT_ACTIONS)[number];

export const SITE_ACTIONS = ['users:manage', 'project:create', 'chem:use', 'mail:read'] as const;
export type SiteAction = (typeof SITE_ACTIONS)[number];

const EVERYONE: readonly ProjectRole[] = ['supervisor', 'modeller', 'student'];
const EDITORS: readonly ProjectRole[] = ['supervisor', 'modeller'];
const SUPERVISORS: readonly ProjectRole[] = ['supervisor'];
const NOBODY: readonly ProjectRole[] = [];

/** Which project roles may do each action in their project (site admins may do all of them). */
export const PROJECT_RULES: Readonly<Record<ProjectAction, readonly ProjectRole[]>> = {
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
  // Proposals write nothing, but they are for editing the draft: the people who may edit ask for them.
  'mapping:propose': EDITORS,
  'mapping:export': EVERYONE,
  'version:save': EDITORS,
  'version:restore': EDITORS,
  'mapping:lock': SUPERVISORS,
  'library:read': EVERYONE,
  'library:edit': EDITORS,
  'thread:read': EVERYONE,
  'comment:create': EVERYONE,
  'comment:moderate': SUPERVISORS,
  // References and analyses: everyone in the project sees them; modellers and supervisors upload and
  // start them; the starter may cancel or remove their own analysis, a supervisor anyone's.
  'reference:read': EVERYONE,
  'reference:create': EDITORS,
  'reference:delete': EDITORS,
  'analysis:start': EDITORS,
  'analysis:manage': SUPERVISORS,
};

/**
 * Site-wide actions (not inside one project): `'any-account'` means every signed-in account; a role
 * list means an account holding one of those roles in any project. Site admins may do all of them.
 */
export const SITE_RULES: Readonly<Record<SiteAction, 'any-account' | readonly ProjectRole[]>> = {
  'users:manage': NOBODY,
  'project:create': SUPERVISORS,
  'chem:use': 'any-account',
  // The local mail sink holds every account's reset links: reading it is taking over any account.
  'mail:read': NOBODY,
};

/** What an account is in one project: a site admin or not, and its role there (null: not a member). */
export interface ProjectStanding {
  isAdmin: boolean;
  role: ProjectRole | null;
}

/** What an account is across the site: a site admin or not, and the roles it holds in any project. */
export interface SiteStanding {
  isAdmin: boolean;
  roles: readonly ProjectRole[];
}

/** Whether the project is visible at all; an invisible project answers 404 to every action. */
export function canSee(who: ProjectStanding | null | undefined): boolean {
  return !!who && (who.isAdmin || who.role !== null);
}

/** Whether `who` may do `action` in a project. null/undefined is nobody signed in. */
export function can(who: ProjectStanding | null | undefined, action: ProjectAction): boolean {
  if (!who) return false;
  if (who.isAdmin) return true;
  return who.role !== null && PROJECT_RULES[action].includes(who.role);
}

/** Whether `who` may do a site-wide `action`. null/undefined is nobody signed in. */
export function canSite(who: SiteStanding | null | undefined, action: SiteAction): boolean {
  if (!who) return false;
  if (who.isAdmin) return true;
  const rule = SITE_RULES[action];
  return rule === 'any-account' || who.roles.some((role) => rule.includes(role));
}
