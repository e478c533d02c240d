import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { signedIn, type ApiClient } from '../helpers/client';
import { createAccount, demoProjectId } from '../helpers/fixtures';
import { createDb, type Db } from '../../server/db/knex';
import { announceWrites, READS_TOPIC } from '../../server/cache/read-cache';

// Issue 18 (capacity): answers of read-mostly GET routes are kept per caller (server/cache/read-cache.ts).
// The first test shows they really are kept (a change through another connection, which announces
// nothing, is not seen), so each later test would fail without the invalidation it names: a write
// through the app's knex (a request, a background job, a transaction), a write announced by a job
// worker, an announcement on the bus from another instance, an access change arriving late.

let t: TestApp;
let projectId: number;
let supervisor: ApiClient;
let modeller: ApiClient;
/** A second connection pool to the same database: writes through it are not watched (another program). */
let behind: Db;
let n = 0;

const projectName = async (client: ApiClient) => (await client.get(`/api/projects/${projectId}`).expect(200)).body.name as string;
const rename = (db: Db, name: string) => db('projects').where({ id: projectId }).update({ name });

beforeAll(async () => {
  t = await createTestApp();
  projectId = await demoProjectId(t.ctx.db);
  supervisor = await signedIn(t.app, 'supervisor@example.org');
  modeller = await signedIn(t.app, 'modeller@example.org');
  behind = createDb(t.database.url);
});
afterAll(async () => {
  await behind.destroy();
  await t.stop();
});

describe('answers kept between requests', () => {
  it('are really kept: a change through another connection is not seen until announced on the bus (as another instance does)', async () => {
    const before = await projectName(modeller);
    await rename(behind, `Renamed behind the back ${++n}`);
    expect(await projectName(modeller)).toBe(before);
    t.ctx.invalidation.publish(READS_TOPIC, 'write');
    expect(await projectName(modeller)).toBe(`Renamed behind the back ${n}`);
  });

  it('a write through a request is seen by the next read of everyone', async () => {
    await projectName(modeller);
    await supervisor.patch(`/api/projects/${projectId}`, { name: `Renamed by a request ${++n}` }).expect(200);
    expect(await projectName(modeller)).toBe(`Renamed by a request ${n}`);
  });

  it("a write through the app's own knex outside a request (a background job) is seen at once", async () => {
    await projectName(modeller);
    await rename(t.ctx.db, `Renamed by a job ${++n}`);
    expect(await projectName(modeller)).toBe(`Renamed by a job ${n}`);
  });

  it('a read made while a transaction is open is not kept past its commit', async () => {
    const before = await projectName(modeller);
    await t.ctx.db.transaction(async (trx) => {
      await trx('projects').where({ id: projectId }).update({ name: `Renamed in a transaction ${++n}` });
      // Not committed yet: other connections still read the old name.
      expect(await projectName(modeller)).toBe(before);
    });
    expect(await projectName(modeller)).toBe(`Renamed in a transaction ${n}`);
  });

  it("a job worker's committed writes are announced (server/worker.ts)", async () => {
    const worker = createDb(t.database.url);
    const watch = announceWrites(worker, t.ctx.invalidation);
    try {
      await projectName(modeller);
      await rename(worker, `Renamed by a worker ${++n}`);
      // The announcement goes out on the next turn of the event loop.
      await new Promise((r) => setImmediate(r));
      expect(await projectName(modeller)).toBe(`Renamed by a worker ${n}`);
    } finally {
      watch.stop();
      await worker.destroy();
    }
  });

  it('an access change drops them (on another instance it may arrive after the write was announced)', async () => {
    const email = `reads${++n}@example.org`;
    const id = await createAccount(t.ctx.db, email, { projectId, role: 'modeller' });
    const client = await signedIn(t.app, email);
    const before = (await client.get('/api/me').expect(200)).body.displayName as string;
    await behind('users').where({ id }).update({ display_name: `Renamed ${n}` });
    expect((await client.get('/api/me').expect(200)).body.displayName).toBe(before);
    t.ctx.accessChanges.publish({ kind: 'account', userId: id });
    expect((await client.get('/api/me').expect(200)).body.displayName).toBe(`Renamed ${n}`);
    // Removed from the project behind the back, then the change arrives: 404 at once.
    await client.get(`/api/projects/${projectId}/members`).expect(200);
    await behind('project_members').where({ project_id: projectId, user_id: id }).delete();
    t.ctx.accessChanges.publish({ kind: 'membership', projectId, userId: id });
    await client.get(`/api/projects/${projectId}/members`).expect(404);
  });

  it('are kept per caller, and answer 304 to a matching If-None-Match', async () => {
    const mine = await modeller.get('/api/me').expect(200);
    const theirs = await supervisor.get('/api/me').expect(200);
    expect(mine.body.email).toBe('modeller@example.org');
    expect(theirs.body.email).toBe('supervisor@example.org');
    const again = await modeller.get('/api/me').expect(200);
    expect(again.headers.etag).toBe(mine.headers.etag);
    expect(again.headers['content-type']).toMatch(/^application\/json/);
    await modeller.get('/api/me').set('If-None-Match', mine.headers.etag!).expect(304);
    // Signed out: nothing kept answers (401, as before).
    await modeller.post('/api/auth/logout').expect(204);
    await modeller.get('/api/me').expect(401);
  });
});
