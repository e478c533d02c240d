import type { Db } from '../../server/db/knex';
import { can, canSee, canSite, type ProjectAction, type ProjectStanding, type SiteAction } from '../../src/shared/permissions';
import { createAccount, createMolecule, demoMappingId, demoMoleculeId, demoProjectId, userId } from '../helpers/fixtures';
import { createThreadFixture, firstBeadId, sharedThread } from './threads-fixtures';
import { importBodyFor, lockedMapping, versionedMapping } from './versions-fixtures';
import { insertReference } from '../../server/references/references.service';

// The route × role table: for every route of the app, what each kind of caller
// gets. The permission test fails when the app has a route that is not here.
// Rows run in order for the roles in ROLES order: refused callers first, so
// a permitted caller's side effect cannot change what a refused one sees.

export const ROLES = ['anonymous', 'nonMember', 'student', 'modeller', 'supervisor', 'admin'] as const;
export type Caller = (typeof ROLES)[number];

export interface RouteCase {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  path: string;
  /** Builds the concrete URL and body for one caller; may create fixtures first. */
  request(env: CaseEnv, caller: Caller): Promise<{ url: string; body?: unknown }>;
  expect: Record<Caller, number>;
  /** Sign in afresh for this row (the request ends the session). */
  fresh?: boolean;
}

export interface CaseEnv {
  db: Db;
  projectId: number;
}

const all = (status: number): Record<Caller, number> => ({ anonymous: status, nonMember: status, student: status, modeller: status, supervisor: status, admin: status });
const signedIn = (status: number) => ({ ...all(status), anonymous: 401 });

// The expected statuses of a guarded route come from the shared rule table (src/shared/permissions.ts),
// so this walk checks that every route asks the table for the right action and answers what it says.
// tests/unit/permissions.test.ts checks the table itself against the product's role description.

/** What each kind of caller is in the demo project (the admin is a site admin and not a member). */
function standing(caller: Exclude<Caller, 'anonymous'>): ProjectStanding {
  if (caller === 'admin') return { isAdmin: true, role: null };
  return { isAdmin: false, role: caller === 'nonMember' ? null : caller };
}

/** A route guarded by a project action: 401 anonymous, 404 when the project is invisible, 403 when the table refuses, else `ok`. */
const byRule = (ok: number, action: ProjectAction): Record<Caller, number> => {
  const out = { anonymous: 401 } as Record<Caller, number>;
  for (const caller of ROLES) {
    if (caller === 'anonymous') continue;
    const who = standing(caller);
    out[caller] = !canSee(who) ? 404 : can(who, action) ? ok : 403;
  }
  return out;
};

/** A route guarded by a site-wide action: 401 anonymous, 403 when the table refuses, else `ok`. */
const bySiteRule = (ok: number, action: SiteAction): Record<Caller, number> => {
  const out = { anonymous: 401 } as Record<Caller, number>;
  for (const caller of ROLES) {
    if (caller === 'anonymous') continue;
    const { isAdmin, role } = standing(caller);
    out[caller] = canSite({ isAdmin, roles: role ? [role] : [] }, action) ? ok : 403;
  }
  return out;
};

const url = (u: string) => async () => ({ url: u });
const project = (suffix = '') => async (env: CaseEnv) => ({ url: `/api/projects/${env.projectId}${suffix}` });
let counter = 0;
const unique = (caller: Caller) => `${caller}-${++counter}-${Date.now()}`;

export const ROUTE_CASES: RouteCase[] = [
  { method: 'get', path: '/api/health', request: url('/api/health'), expect: all(200) },
  { method: 'get', path: '/api/auth/csrf', request: url('/api/auth/csrf'), expect: all(200) },
  {
    method: 'post',
    path: '/api/auth/login',
    request: async () => ({ url: '/api/auth/login', body: { email: 'nobody-here@example.org', password: 'wrong password' } }),
    expect: all(401),
  },
  { method: 'post', path: '/api/auth/logout', request: url('/api/auth/logout'), expect: all(204), fresh: true },
  { method: 'post', path: '/api/auth/forgot', request: async () => ({ url: '/api/auth/forgot', body: { email: 'nobody-here@example.org' } }), expect: all(202) },
  {
    method: 'post',
    path: '/api/auth/reset',
    request: async () => ({ url: '/api/auth/reset', body: { token: 'x'.repeat(43), password: 'a new password 123' } }),
    expect: all(400),
  },
  { method: 'get', path: '/api/me', request: url('/api/me'), expect: signedIn(200) },
  { method: 'patch', path: '/api/me', request: async (_e, c) => ({ url: '/api/me', body: { displayName: `Renamed ${c}` } }), expect: signedIn(200) },
  {
    method: 'post',
    path: '/api/me/password',
    request: async () => ({ url: '/api/me/password', body: { currentPassword: 'not the password', newPassword: 'another password 1' } }),
    expect: signedIn(400),
  },
  { method: 'get', path: '/api/users', request: url('/api/users'), expect: bySiteRule(200, 'users:manage') },
  {
    method: 'post',
    path: '/api/users',
    request: async (_e, c) => ({ url: '/api/users', body: { email: `${unique(c)}@example.org`, displayName: 'New person' } }),
    expect: bySiteRule(201, 'users:manage'),
  },
  {
    method: 'patch',
    path: '/api/users/:id',
    request: async (env, c) => ({ url: `/api/users/${await createAccount(env.db, `${unique(c)}@example.org`)}`, body: { displayName: 'Changed' } }),
    expect: bySiteRule(200, 'users:manage'),
  },
  { method: 'get', path: '/api/projects', request: url('/api/projects'), expect: signedIn(200) },
  {
    method: 'post',
    path: '/api/projects',
    request: async (_e, c) => ({ url: '/api/projects', body: { name: `Project of ${c}` } }),
    expect: bySiteRule(201, 'project:create'),
  },
  { method: 'get', path: '/api/projects/:id', request: project(), expect: byRule(200, 'project:read') },
  { method: 'patch', path: '/api/projects/:id', request: async (env) => ({ url: `/api/projects/${env.projectId}`, body: { description: 'Updated.' } }), expect: byRule(200, 'project:update') },
  { method: 'get', path: '/api/projects/:id/members', request: project('/members'), expect: byRule(200, 'members:read') },
  {
    method: 'post',
    path: '/api/projects/:id/members',
    request: async (env, c) => ({ url: `/api/projects/${env.projectId}/members`, body: { email: `${unique(c)}@example.org`, role: 'student' } }),
    expect: byRule(201, 'members:manage'),
  },
  {
    method: 'patch',
    path: '/api/projects/:id/members/:userId',
    request: async (env, c) => {
      const id = await createAccount(env.db, `${unique(c)}@example.org`, { projectId: env.projectId, role: 'student' });
      return { url: `/api/projects/${env.projectId}/members/${id}`, body: { role: 'modeller' } };
    },
    expect: byRule(200, 'members:manage'),
  },
  {
    method: 'delete',
    path: '/api/projects/:id/members/:userId',
    request: async (env, c) => {
      const id = await createAccount(env.db, `${unique(c)}@example.org`, { projectId: env.projectId, role: 'student' });
      return { url: `/api/projects/${env.projectId}/members/${id}` };
    },
    expect: byRule(204, 'members:manage'),
  },
  { method: 'get', path: '/api/projects/:id/molecules', request: project('/molecules'), expect: byRule(200, 'molecule:read') },
  { method: 'get', path: '/api/projects/:id/mappings', request: project('/mappings'), expect: byRule(200, 'mapping:read') },
  {
    method: 'post',
    path: '/api/chem/molecule',
    request: async () => ({ url: '/api/chem/molecule', body: { smiles: 'CCO' } }),
    expect: bySiteRule(200, 'chem:use'),
  },
  {
    method: 'post',
    path: '/api/chem/evaluate',
    request: async () => ({
      url: '/api/chem/evaluate',
      body: { smiles: 'CCO', mapping: { beads: [{ id: 'b1', name: 'E', centre: 'mass', atoms: [{ index: 0, weight: 1 }, { index: 1, weight: 1 }, { index: 2, weight: 1 }] }] } },
    }),
    expect: bySiteRule(200, 'chem:use'),
  },
  {
    method: 'post',
    path: '/api/projects/:id/molecules',
    request: async (env, c) => ({ url: `/api/projects/${env.projectId}/molecules`, body: { name: `Methanol of ${c}`, smiles: 'CO', allowDuplicate: true } }),
    expect: byRule(201, 'molecule:create'),
  },
  // A JSON body is not an upload: callers who may upload get 400 (no file), the rest are refused first.
  { method: 'post', path: '/api/projects/:id/molecules/upload', request: project('/molecules/upload'), expect: byRule(400, 'molecule:create') },
  { method: 'get', path: '/api/molecules/:id', request: async (env) => ({ url: `/api/molecules/${await demoMoleculeId(env.db)}` }), expect: byRule(200, 'molecule:read') },
  {
    method: 'patch',
    path: '/api/molecules/:id',
    request: async (env, c) => ({ url: `/api/molecules/${await demoMoleculeId(env.db)}`, body: { notes: `Edited by ${c}.` } }),
    expect: byRule(200, 'molecule:update'),
  },
  {
    method: 'delete',
    path: '/api/molecules/:id',
    request: async (env, c) => ({ url: `/api/molecules/${await createMolecule(env.db, env.projectId, `Doomed ${unique(c)}`)}` }),
    expect: byRule(204, 'molecule:delete'),
  },
  { method: 'get', path: '/api/molecules/:id/mappings', request: async (env) => ({ url: `/api/molecules/${await demoMoleculeId(env.db)}/mappings` }), expect: byRule(200, 'mapping:read') },
  {
    method: 'post',
    path: '/api/molecules/:id/mappings',
    request: async (env, c) => ({ url: `/api/molecules/${await demoMoleculeId(env.db)}/mappings`, body: { name: `Mapping of ${c}`, resolution: '2:1' } }),
    expect: byRule(201, 'mapping:create'),
  },
  { method: 'get', path: '/api/mappings/:id', request: async (env) => ({ url: `/api/mappings/${await demoMappingId(env.db)}` }), expect: byRule(200, 'mapping:read') },
  {
    method: 'patch',
    path: '/api/mappings/:id',
    request: async (env, c) => ({ url: `/api/mappings/${await demoMappingId(env.db)}`, body: { description: `Notes by ${c}.` } }),
    expect: byRule(200, 'mapping:edit'),
  },
  {
    method: 'post',
    path: '/api/mappings/:id/proposal',
    request: async (env) => ({ url: `/api/mappings/${await demoMappingId(env.db)}/proposal`, body: { scope: 'unassigned' } }),
    expect: byRule(200, 'mapping:propose'),
  },
  { method: 'get', path: '/api/projects/:id/bead-types', request: project('/bead-types'), expect: byRule(200, 'library:read') },
  {
    method: 'put',
    path: '/api/projects/:id/bead-types',
    request: async (env, c) => ({
      url: `/api/projects/${env.projectId}/bead-types`,
      body: { types: [{ name: `X-${c}`, heavyAtomsPerBead: 4, charge: 0, deltaGMin: -5, deltaGMax: 5 }] },
    }),
    expect: byRule(200, 'library:edit'),
  },
  // The bonded-terms table of a mapping's draft (docs/exports.md).
  { method: 'get', path: '/api/mappings/:id/bonded-terms', request: async (env) => ({ url: `/api/mappings/${await demoMappingId(env.db)}/bonded-terms` }), expect: byRule(200, 'mapping:read') },
  {
    method: 'put',
    path: '/api/mappings/:id/bonded-terms',
    request: async (env) => ({ url: `/api/mappings/${await demoMappingId(env.db)}/bonded-terms`, body: { terms: [], exclusions: 1 } }),
    expect: byRule(200, 'mapping:edit'),
  },
  // The caught mail holds reset links: a site admin only; anyone else gets the unknown-route 404.
  { method: 'get', path: '/dev/mail', request: url('/dev/mail'), expect: { ...all(404), admin: 200 } },
  { method: 'get', path: '/dev/mail.json', request: url('/dev/mail.json'), expect: { ...all(404), admin: 200 } },
  // Threads and notifications (docs/threads.md). Event streams answer 406 to a caller that does not ask
  // for text/event-stream, after the permission check; tests/api/threads-live.test.ts reads the streams.
  { method: 'get', path: '/api/mappings/:id/threads', request: async (env) => ({ url: `/api/mappings/${await demoMappingId(env.db)}/threads` }), expect: byRule(200, 'thread:read') },
  {
    method: 'post',
    path: '/api/mappings/:id/threads',
    request: async (env, c) => {
      const mappingId = await demoMappingId(env.db);
      return { url: `/api/mappings/${mappingId}/threads`, body: { beadId: await firstBeadId(env.db, mappingId), body: `Opened by ${c}.` } };
    },
    expect: byRule(201, 'comment:create'),
  },
  {
    method: 'post',
    path: '/api/threads/:id/comments',
    request: async (env, c) => ({ url: `/api/threads/${(await sharedThread(env.db)).threadId}/comments`, body: { body: `Reply by ${c}.` } }),
    expect: byRule(201, 'comment:create'),
  },
  {
    method: 'patch',
    path: '/api/threads/:id',
    request: async (env) => ({ url: `/api/threads/${(await sharedThread(env.db)).threadId}`, body: { resolved: true } }),
    expect: byRule(200, 'comment:create'),
  },
  // Only its author (here the modeller) edits a comment; supervisors and admins may not either.
  {
    method: 'patch',
    path: '/api/comments/:id',
    request: async (env, c) => ({ url: `/api/comments/${(await sharedThread(env.db)).commentId}`, body: { body: `Edit attempt by ${c}.` } }),
    expect: { ...byRule(200, 'comment:create'), student: 403, supervisor: 403, admin: 403 },
  },
  // Its author (the modeller) deletes a comment under 'comment:create'; anyone else needs 'comment:moderate'.
  {
    method: 'delete',
    path: '/api/comments/:id',
    request: async (env) => ({ url: `/api/comments/${(await createThreadFixture(env.db)).commentId}` }),
    expect: { ...byRule(204, 'comment:moderate'), modeller: 204 },
  },
  { method: 'get', path: '/api/mappings/:id/events', request: async (env) => ({ url: `/api/mappings/${await demoMappingId(env.db)}/events` }), expect: byRule(406, 'thread:read') },
  { method: 'get', path: '/api/notifications', request: url('/api/notifications'), expect: signedIn(200) },
  { method: 'post', path: '/api/notifications/read', request: async () => ({ url: '/api/notifications/read', body: { all: true } }), expect: signedIn(200) },
  { method: 'get', path: '/api/notifications/events', request: url('/api/notifications/events'), expect: signedIn(406) },
  { method: 'get', path: '/api/me/preferences', request: url('/api/me/preferences'), expect: signedIn(200) },
  { method: 'put', path: '/api/me/preferences', request: async () => ({ url: '/api/me/preferences', body: { emailOnMention: true, emailOnReply: false } }), expect: signedIn(200) },
  // Versions, compare, restore, the production lock, the audit trail, exports and import (docs/exports.md).
  { method: 'get', path: '/api/mappings/:id/versions', request: async (env) => ({ url: `/api/mappings/${await shared(env).then((m) => m.mappingId)}/versions` }), expect: byRule(200, 'mapping:read') },
  { method: 'post', path: '/api/mappings/:id/versions', request: async (env, c) => ({ url: `/api/mappings/${(await shared(env)).mappingId}/versions`, body: { message: `Saved by ${c}` } }), expect: byRule(201, 'version:save') },
  { method: 'get', path: '/api/mappings/:id/versions/:n', request: async (env) => ({ url: `/api/mappings/${(await shared(env)).mappingId}/versions/1` }), expect: byRule(200, 'mapping:read') },
  { method: 'post', path: '/api/mappings/:id/versions/:n/restore', request: async (env) => ({ url: `/api/mappings/${(await shared(env)).mappingId}/versions/1/restore` }), expect: byRule(200, 'version:restore') },
  { method: 'get', path: '/api/mappings/:id/compare', request: async (env) => ({ url: `/api/mappings/${(await shared(env)).mappingId}/compare?from=1&to=draft` }), expect: byRule(200, 'mapping:read') },
  { method: 'get', path: '/api/mappings/:id/lock', request: async (env) => ({ url: `/api/mappings/${(await shared(env)).mappingId}/lock` }), expect: byRule(200, 'mapping:read') },
  // Each caller locks (or unlocks) a mapping of its own, so one success cannot turn the next into a 409.
  { method: 'post', path: '/api/mappings/:id/lock', request: async (env, c) => ({ url: `/api/mappings/${(await versionedMapping(env.db, `Lock ${unique(c)}`)).mappingId}/lock`, body: { version: 1 } }), expect: byRule(200, 'mapping:lock') },
  { method: 'post', path: '/api/mappings/:id/unlock', request: async (env, c) => ({ url: `/api/mappings/${await lockedMapping(env.db, `Unlock ${unique(c)}`)}/unlock`, body: { reason: `Unlocked by ${c}` } }), expect: byRule(200, 'mapping:lock') },
  { method: 'get', path: '/api/mappings/:id/audit', request: async (env) => ({ url: `/api/mappings/${(await shared(env)).mappingId}/audit` }), expect: byRule(200, 'mapping:read') },
  { method: 'get', path: '/api/mappings/:id/export', request: async (env) => ({ url: `/api/mappings/${(await shared(env)).mappingId}/export?format=csv&version=1` }), expect: byRule(200, 'mapping:export') },
  { method: 'get', path: '/api/projects/:id/export.zip', request: project('/export.zip'), expect: byRule(200, 'mapping:export') },
  {
    method: 'post',
    path: '/api/molecules/:id/mappings/import',
    request: async (env) => {
      const { moleculeId } = await shared(env);
      return { url: `/api/molecules/${moleculeId}/mappings/import`, body: await importBodyFor(env.db, moleculeId) };
    },
    expect: byRule(201, 'mapping:create'),
  },
  // References (issue 15). The upload sends no file here, so a permitted caller gets 400.
  { method: 'post', path: '/api/molecules/:id/references', request: async (env) => ({ url: `/api/molecules/${(await shared(env)).moleculeId}/references`, body: {} }), expect: byRule(400, 'reference:create') },
  { method: 'get', path: '/api/molecules/:id/references', request: async (env) => ({ url: `/api/molecules/${(await shared(env)).moleculeId}/references` }), expect: byRule(200, 'reference:read') },
  { method: 'get', path: '/api/references/:id', request: async (env) => ({ url: `/api/references/${await referenceFixture(env, 'shared')}` }), expect: byRule(200, 'reference:read') },
  // The fixture reference is queued, not failed: a permitted caller gets 409 (nothing runs).
  { method: 'post', path: '/api/references/:id/match', request: async (env) => ({ url: `/api/references/${await referenceFixture(env, 'shared')}/match`, body: { selection: null } }), expect: byRule(409, 'reference:create') },
  { method: 'delete', path: '/api/references/:id', request: async (env, c) => ({ url: `/api/references/${await referenceFixture(env, unique(c))}` }), expect: byRule(204, 'reference:delete') },
  // Analyses: the fixture reference is not ready, so a permitted start gets 409 (nothing runs).
  { method: 'post', path: '/api/mappings/:id/analyses', request: async (env) => ({ url: `/api/mappings/${(await shared(env)).mappingId}/analyses`, body: { referenceId: await referenceFixture(env, 'shared'), version: 1 } }), expect: byRule(409, 'analysis:start') },
  { method: 'get', path: '/api/mappings/:id/analyses', request: async (env) => ({ url: `/api/mappings/${(await shared(env)).mappingId}/analyses` }), expect: byRule(200, 'reference:read') },
  { method: 'get', path: '/api/analyses/:id', request: async (env) => ({ url: `/api/analyses/${await analysisFixture(env, 'shared', 'done')}` }), expect: byRule(200, 'reference:read') },
  // Each caller removes a finished analysis of its own making (an admin may remove anyone's).
  { method: 'delete', path: '/api/analyses/:id', request: async (env, c) => ({ url: `/api/analyses/${await analysisFixture(env, unique(c), 'done', c)}` }), expect: byRule(204, 'analysis:start') },
  { method: 'get', path: '/api/analyses/:id/terms.csv', request: async (env) => ({ url: `/api/analyses/${await analysisFixture(env, 'shared', 'done')}/terms.csv` }), expect: byRule(200, 'mapping:export') },
  // No centres file in the fixture: a permitted caller is answered 200 with the header, then the stream fails; 409 when unfinished.
  { method: 'get', path: '/api/analyses/:id/cg-trajectory', request: async (env) => ({ url: `/api/analyses/${await analysisFixture(env, 'running', 'running')}/cg-trajectory?format=gro` }), expect: byRule(409, 'mapping:export') },
];

/** An analysis row of the shared mapping and reference with an empty result (no files). */
const analyses = new Map<string, Promise<number>>();
function analysisFixture(env: CaseEnv, key: string, status: 'done' | 'running', caller?: Caller): Promise<number> {
  if (!analyses.has(key)) {
    analyses.set(
      key,
      (async () => {
        const { mappingId } = await shared(env);
        const referenceId = await referenceFixture(env, 'shared');
        const email = caller && caller !== 'anonymous' && caller !== 'nonMember' ? `${caller}@example.org` : null;
        const createdBy = email ? ((await env.db('users').where({ email }).first('id'))?.id ?? null) : null;
        const [id] = await env.db('analyses').insert({
          mapping_id: mappingId,
          reference_id: referenceId,
          version_ref: '1',
          version_number: 1,
          content_sha256: '0'.repeat(64),
          temperature: 298.15,
          bins: 10,
          status,
          mapping_state: JSON.stringify({ beads: [], terms: [], order: [], via: [] }),
          result: status === 'done' ? JSON.stringify({ frames: 0, copies: 0, beads: [], bonds: [], angles: [], dihedrals: [] }) : null,
          created_by: createdBy,
        });
        return id as number;
      })(),
    );
  }
  return analyses.get(key)!;
}

/** A reference row of the shared molecule (no files; enough for reading and deleting). */
const references = new Map<string, Promise<number>>();
function referenceFixture(env: CaseEnv, key: string): Promise<number> {
  const k = `${key}`;
  if (!references.has(k) || key !== 'shared') {
    references.set(
      k,
      shared(env).then(({ moleculeId }) =>
        insertReference(env.db, { moleculeId, projectId: env.projectId, name: `Reference ${key}`, structureName: 'box.gro', structureFormat: 'gro', trajectoryName: null, trajectoryFormat: null, selection: null, bytes: 0, createdBy: null }),
      ),
    );
  }
  return references.get(k)!;
}

/** One versioned mapping shared by the read-only version rows (made on first use). */
const versioned = new WeakMap<Db, Promise<{ moleculeId: number; mappingId: number }>>();
function shared(env: CaseEnv) {
  if (!versioned.has(env.db)) versioned.set(env.db, versionedMapping(env.db, 'Permission walk'));
  return versioned.get(env.db)!;
}

export async function caseEnv(db: Db): Promise<CaseEnv> {
  await userId(db, 'supervisor@example.org');
  return { db, projectId: await demoProjectId(db) };
}

