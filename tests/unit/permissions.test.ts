import { describe, expect, it } from 'vitest';
import { can, canSee, canSite, PROJECT_ACTIONS, type ProjectAction, type ProjectStanding } from '../../src/shared/permissions';

// The shared rule table checked against the product's description of the roles (PRODUCT.md,
// "People and roles"), written out here by hand, action by action. tests/api/permissions.test.ts
// then checks that every HTTP route answers what this table says.
//
//   admin       everything; manages user accounts
//   supervisor  all a modeller may; manage project members; lock and unlock a version
//   modeller    create molecules and mappings; edit drafts; save and restore versions; comment
//   student     read everything in the project; export; comment; never edit a draft
//   not member  nothing in that project (404)

const student: ProjectStanding = { isAdmin: false, role: 'student' };
const modeller: ProjectStanding = { isAdmin: false, role: 'modeller' };
const supervisor: ProjectStanding = { isAdmin: false, role: 'supervisor' };
const outsider: ProjectStanding = { isAdmin: false, role: null };
const admin: ProjectStanding = { isAdmin: true, role: null };

// Who may, per PRODUCT.md: 'S' student, 'M' modeller, 'V' supervisor (admins always may).
const EXPECTED: Record<ProjectAction, string> = {
  'project:read': 'SMV', // read everything
  'project:update': 'V', // managing the project is the supervisor's
  'members:read': 'SMV',
  'members:manage': 'V', // manage project members
  'molecule:read': 'SMV',
  'molecule:create': 'MV', // create molecules
  'molecule:update': 'MV',
  'molecule:delete': 'MV',
  'mapping:read': 'SMV',
  'mapping:create': 'MV', // create mappings
  'mapping:edit': 'MV', // edit drafts live; never the student
  'mapping:propose': 'MV', // ask for proposals to edit the draft with; never the student
  'mapping:export': 'SMV', // students export
  'version:save': 'MV', // save versions
  'version:restore': 'MV', // restore a version into the draft
  'mapping:lock': 'V', // lock for production and unlock
  'library:read': 'SMV',
  'library:edit': 'MV', // the bead type library is edited like a draft (not named in PRODUCT.md)
  'thread:read': 'SMV',
  'comment:create': 'SMV', // everyone comments
  'comment:moderate': 'V', // removing others' comments manages the project (not named in PRODUCT.md)
  'reference:read': 'SMV', // issue 15: everyone in the project sees references and analyses
  'reference:create': 'MV', // uploading a reference is a modeller's work
  'reference:delete': 'MV',
  'analysis:start': 'MV', // issue 15: modellers and supervisors start analyses; a student may not (403)
  'analysis:manage': 'V', // cancelling or removing someone else's analysis manages the project
};

describe('the shared permission table', () => {
  it('lists every action once, and has an expectation for each', () => {
    expect(new Set(PROJECT_ACTIONS).size).toBe(PROJECT_ACTIONS.length);
    expect(Object.keys(EXPECTED).sort()).toEqual([...PROJECT_ACTIONS].sort());
  });

  for (const action of PROJECT_ACTIONS) {
    it(`${action}: the roles of the product description`, () => {
      const got = { student: can(student, action), modeller: can(modeller, action), supervisor: can(supervisor, action) };
      const want = EXPECTED[action];
      expect(got).toEqual({ student: want.includes('S'), modeller: want.includes('M'), supervisor: want.includes('V') });
      expect(can(admin, action)).toBe(true);
      expect(can(outsider, action)).toBe(false);
      expect(can(null, action)).toBe(false);
    });
  }

  it('hides a project from non-members and nobody, not from admins', () => {
    expect([canSee(outsider), canSee(null), canSee(admin), canSee(student)]).toEqual([false, false, true, true]);
  });

  it('site actions: accounts are the admin’s, projects are created by supervisors, chemistry by anyone signed in', () => {
    const site = (isAdmin: boolean, roles: ProjectStanding['role'][]) => ({ isAdmin, roles: roles.filter((r) => r !== null) });
    expect(canSite(site(false, ['supervisor']), 'users:manage')).toBe(false);
    expect(canSite(site(true, []), 'users:manage')).toBe(true);
    expect(canSite(site(false, ['student', 'supervisor']), 'project:create')).toBe(true);
    expect(canSite(site(false, ['modeller']), 'project:create')).toBe(false);
    expect(canSite(site(false, []), 'chem:use')).toBe(true);
    expect(canSite(null, 'chem:use')).toBe(false);
    expect(canSite(site(false, ['supervisor']), 'mail:read')).toBe(false);
  });
});
