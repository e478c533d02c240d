import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Queue } from 'bullmq';
import { startRedis, type RunningRedis } from '../../scripts/lib/redis';
import { startCluster, type RunningCluster } from '../../scripts/lib/cluster';
import { freePort } from '../../scripts/lib/free-port';
import { createTestDatabase, type TestDatabase } from '../helpers/db';
import { seedDemo } from '../../seeds/demo';
import { connectClient, signInOverHttp, synced, until, type CollabClient } from '../helpers/collab-client';
import { createAccount, createMolecule, demoMappingId, demoProjectId } from '../helpers/fixtures';
import type { AnalysisView } from '../../src/shared/references';
import { beadsOf, createBead } from '../../src/shared/mapping-doc';
import { QUEUES, bullConnection } from '../../server/jobs/bull-queues';
import { groText, makeSystem } from '../helpers/reference-systems';
import { generateConformer } from '../../server/chem/index';
import { createMapping } from '../../server/mappings/mappings.service';
import type { Molecule } from '../../src/shared/chem';

// Issue 18: two app instances (A, B) and one job worker on one MariaDB and one Redis, behind nginx
// (scripts/cluster/nginx.conf.template), each a real process started once for this file by
// scripts/lib/cluster.ts — the same code `npm run start:cluster` runs. Clients talk to A or B
// directly (to know which instance they are on) or through nginx (to be moved when one dies).

let database: TestDatabase;
let redis: RunningRedis;
let cluster: RunningCluster;
let dir: string;
let mappingId: number;
let projectId: number;
let A: string;
let B: string;
const open: CollabClient[] = [];
let n = 0;

const connect = async (url: string, cookie: string) => {
  const c = connectClient(url, mappingId, cookie);
  open.push(c);
  await synced(c);
  return c;
};
const cookieOf = async (url: string, email: string) => (await signInOverHttp(url, email)).cookie;
const storedDraftIds = async (cookie: string) => {
  const res = await fetch(`${cluster.url}/api/mappings/${mappingId}`, { headers: { cookie } });
  return ((await res.json()).draft.beads as { id: string }[]).map((b) => b.id);
};

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'beadloom-cluster-'));
  database = await createTestDatabase();
  await seedDemo(database.db, 12);
  mappingId = await demoMappingId(database.db);
  projectId = await demoProjectId(database.db);
  redis = await startRedis({ port: await freePort(), dir: join(dir, 'redis') });
  // nginx on a free port P, the instances on P+1 and P+2 (free in practice: checked by their start).
  const port = await freePort();
  cluster = await startCluster({
    databaseUrl: database.url,
    redisUrl: redis.url,
    port,
    instances: 2,
    workers: 1,
    dir: join(dir, 'nginx'),
    output: process.env.CLUSTER_OUTPUT === 'inherit' ? 'inherit' : 'ignore',
    env: { SESSION_SECRET: 'cluster-test-secret-that-is-long-enough-0123', LOG_LEVEL: 'warn', CLIENT_DIR: join(dir, 'no-client'), LOGIN_LIMIT_IP: '1000', BEADLOOM_DATA_DIR: join(dir, 'files') },
  });
  [A, B] = cluster.instanceUrls;
}, 120_000);

afterAll(async () => {
  for (const c of open) c.destroy();
  await cluster?.stop();
  await redis?.stop();
  await database?.drop();
  rmSync(dir, { recursive: true, force: true });
}, 60_000);

describe('two app servers behind nginx', () => {
  it('clients on different instances converge, and both get evaluations', async () => {
    const a = await connect(A, await cookieOf(A, 'modeller@example.org'));
    const b = await connect(B, await cookieOf(B, 'supervisor@example.org'));
    createBead(a.doc, [0], { id: 'from-a' });
    createBead(b.doc, [1], { id: 'from-b' });
    await until('both edits on both', () => ['from-a', 'from-b'].every((id) => beadsOf(a.doc).has(id) && beadsOf(b.doc).has(id)));
    // Evaluations of the draft with both beads reach both sides (one instance computed it: the lease).
    const hasBoth = (c: CollabClient) => c.evaluations.some((e) => (e.evaluation?.beads ?? []).filter((x) => x.id === 'from-a' || x.id === 'from-b').length === 2);
    await until('an evaluation with both beads on both', () => hasBoth(a) && hasBoth(b));
    expect(await storedDraftIds(await cookieOf(cluster.url, 'supervisor@example.org'))).toEqual(expect.arrayContaining(['from-a', 'from-b']));
  });

  it('a student’s write is dropped on both instances', async () => {
    const student = await connect(A, await cookieOf(A, 'student@example.org'));
    const onA = await connect(A, await cookieOf(A, 'modeller@example.org'));
    const onB = await connect(B, await cookieOf(B, 'modeller@example.org'));
    expect(student.session?.readOnly).toBe(true);
    createBead(student.doc, [2], { id: 'by-student' });
    await until('the read-only notice', () => student.errors.some((e) => e.code === 'read_only'));
    // A later edit from A reaches B: anything relayed before it would have arrived too.
    createBead(onA.doc, [3], { id: 'marker-1' });
    await until('the marker on B', () => beadsOf(onB.doc).has('marker-1'));
    expect(beadsOf(onB.doc).has('by-student')).toBe(false);
    expect(beadsOf(onA.doc).has('by-student')).toBe(false);
  });

  it('awareness crosses instances', async () => {
    const a = await connect(A, await cookieOf(A, 'modeller@example.org'));
    const b = await connect(B, await cookieOf(B, 'supervisor@example.org'));
    a.provider.awareness.setLocalStateField('selection', { atoms: [4, 5] });
    await until('A’s selection seen on B', () => [...b.provider.awareness.getStates().values()].some((s) => JSON.stringify(s.selection) === JSON.stringify({ atoms: [4, 5] })));
  });

  it('a role change made on A turns a socket on B read-only within 1 s', async () => {
    const email = 'moved@example.org';
    const id = await createAccount(database.db, email, { projectId, role: 'modeller' });
    const onB = await connect(B, await cookieOf(B, email));
    expect(onB.session).toMatchObject({ readOnly: false, role: 'modeller' });
    const sup = await signInOverHttp(A, 'supervisor@example.org');
    const started = performance.now();
    const res = await fetch(`${A}/api/projects/${projectId}/members/${id}`, {
      method: 'PATCH',
      headers: { cookie: sup.cookie, 'x-csrf-token': sup.csrfToken, 'content-type': 'application/json' },
      body: JSON.stringify({ role: 'student' }),
    });
    expect(res.status).toBe(200);
    await until('read-only on B', () => onB.session?.readOnly === true && onB.session.role === 'student');
    expect(performance.now() - started).toBeLessThan(1000);
  });

  it('a conformer job started through A runs on the worker, and B shows the result', async () => {
    const sup = await signInOverHttp(A, 'supervisor@example.org');
    const res = await fetch(`${A}/api/projects/${projectId}/molecules`, {
      method: 'POST',
      headers: { cookie: sup.cookie, 'x-csrf-token': sup.csrfToken, 'content-type': 'application/json' },
      body: JSON.stringify({ name: 'Propanol for the worker', smiles: 'CCCO' }),
    });
    expect(res.status).toBe(201);
    const { id } = (await res.json()) as { id: number };
    const status = async () => ((await (await fetch(`${B}/api/molecules/${id}`, { headers: { cookie: sup.cookie } })).json()).coordinates.status as string);
    await until('coordinates done, seen through B', async () => (await status()) === 'done', 60_000);
    const queue = new Queue(QUEUES.conformers, { connection: bullConnection(redis.url) });
    const completed = await queue.getCompleted();
    await queue.close();
    expect(completed.some((j) => j.data.moleculeId === id && j.finishedOn !== undefined)).toBe(true);
  }, 90_000);

  it('reference matching and an analysis started through A run on the worker; B shows their progress', async () => {
    const sup = await signInOverHttp(A, 'modeller@example.org');
    const post = (path: string, body: BodyInit, json = true) =>
      fetch(`${A}${path}`, { method: 'POST', headers: { cookie: sup.cookie, 'x-csrf-token': sup.csrfToken, ...(json ? { 'content-type': 'application/json' } : {}) }, body });
    const onB = async <T>(path: string) => (await (await fetch(`${B}${path}`, { headers: { cookie: sup.cookie } })).json()) as T;
    // An invented surfactant and a synthetic trajectory of 8 copies (tests/helpers/reference-systems.ts).
    const moleculeId = await createMolecule(database.db, projectId, 'Invented surfactant', 'CCCCCCOCCOCCO');
    const mol = JSON.parse((await database.db('molecules').where({ id: moleculeId }).first('model')).model) as Molecule;
    const sys = makeSystem(mol, await generateConformer(mol, { seed: 3 }), { copies: 8, frames: 200, boxA: 40, noiseA: 0.06, seed: 5, residue: 'SUR', solvent: 10 });
    const beads = [[0, 1, 2], [3, 4, 5], [6, 7, 8], [9, 10, 11, 12]].map((atoms, i) => ({ id: `b${i}`, name: `B${i}`, centre: 'mass' as const, atoms: atoms.map((index) => ({ index, weight: 1 })) }));
    const mapping = await createMapping(database.db, moleculeId, { name: 'Surfactant 3:1', resolution: '3:1' }, null as unknown as number, { beads });
    expect((await post(`/api/mappings/${mapping}/versions`, JSON.stringify({ message: 'For the reference' }))).status).toBe(201);

    const form = new FormData();
    form.append('structure', new Blob([groText(sys, sys.frames.slice(0, 1))]), 'box.gro');
    form.append('trajectory', new Blob([groText(sys)]), 'traj.gro');
    const upload = await post(`/api/molecules/${moleculeId}/references`, form, false);
    expect(upload.status).toBe(202);
    const referenceId = ((await upload.json()) as { id: number }).id;
    await until('the reference matched (on the worker), seen through B', async () => (await onB<{ status: string }>(`/api/references/${referenceId}`)).status === 'ready', 60_000);

    const started = await post(`/api/mappings/${mapping}/analyses`, JSON.stringify({ referenceId, version: 1 }));
    expect(started.status).toBe(202);
    const analysisId = ((await started.json()) as { id: number }).id;
    const seen: string[] = [];
    await until(
      'the analysis done, seen through B',
      async () => {
        const view = await onB<AnalysisView>(`/api/analyses/${analysisId}`);
        seen.push(`${view.status} ${view.progress.done}/${view.progress.total}`);
        return view.status === 'done';
      },
      60_000,
    );
    expect(seen.at(-1)).toBe('done 200/200');
    expect(seen.length).toBeGreaterThan(1); // B saw it before it was done (queued or running)
    // Both jobs went through BullMQ's task queue and finished there (only workers take jobs from it).
    const queue = new Queue(QUEUES.tasks, { connection: bullConnection(redis.url) });
    const finished = (await queue.getCompleted()).map((j) => `${j.name} ${JSON.stringify(j.data)}`);
    await queue.close();
    expect(finished).toEqual(expect.arrayContaining([`reference-match {"referenceId":${referenceId}}`, `analysis {"analysisId":${analysisId}}`]));
  }, 120_000);

  it('sign-in limits are shared: failures on A block the next attempt on B', async () => {
    const attempt = async (url: string) => {
      const csrf = await fetch(`${url}/api/auth/csrf`);
      const cookie = csrf.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
      const { token } = (await csrf.json()) as { token: string };
      const r = await fetch(`${url}/api/auth/login`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', cookie, 'x-csrf-token': token },
        body: JSON.stringify({ email: 'nobody-here@example.org', password: 'wrong-password-123' }),
      });
      return r.status;
    };
    for (let i = 0; i < 5; i++) expect(await attempt(A)).toBe(401);
    expect(await attempt(B)).toBe(429);
  });

  it('Redis restarted mid-session: both instances resubscribe and catch up from MariaDB, nothing lost', async () => {
    const a = await connect(A, await cookieOf(A, 'modeller@example.org'));
    const b = await connect(B, await cookieOf(B, 'supervisor@example.org'));
    const restarting = redis.restart();
    const ids: string[] = [];
    for (let i = 0; i < 5; i++) {
      const id = `during-restart-${++n}`;
      ids.push(id);
      createBead(i % 2 ? b.doc : a.doc, [i], { id });
      await new Promise((r) => setTimeout(r, 20));
    }
    await restarting;
    const after = `after-restart-${++n}`;
    ids.push(after);
    createBead(a.doc, [6], { id: after });
    await until('every edit on both', () => ids.every((id) => beadsOf(a.doc).has(id) && beadsOf(b.doc).has(id)), 20_000);
    expect(await storedDraftIds(await cookieOf(cluster.url, 'supervisor@example.org'))).toEqual(expect.arrayContaining(ids));
  }, 40_000);

  it('SIGKILL of one instance mid-edit: its clients reconnect through nginx and no relayed edit is lost', async () => {
    // Four clients through nginx (round robin puts them on both instances).
    const cookies = await Promise.all(['modeller@example.org', 'supervisor@example.org', 'modeller@example.org', 'supervisor@example.org'].map((e) => cookieOf(cluster.url, e)));
    const clients: CollabClient[] = [];
    for (const c of cookies) clients.push(await connect(cluster.url, c));
    const ids: string[] = [];
    const edit = (i: number) => {
      const id = `kill-${++n}`;
      ids.push(id);
      createBead(clients[i % clients.length].doc, [i % 10], { id });
    };
    for (let i = 0; i < 8; i++) edit(i);
    // Every edit so far relayed to every client (so each went through an instance and MariaDB).
    await until('the first edits everywhere', () => clients.every((c) => ids.every((id) => beadsOf(c.doc).has(id))));
    const relayed = [...ids];
    const closesBefore = clients.map((c) => c.closes.length);
    await cluster.kill(0);
    for (let i = 0; i < 8; i++) edit(i);
    await until('every edit on every client after reconnecting', () => clients.every((c) => c.provider.wsconnected && ids.every((id) => beadsOf(c.doc).has(id))), 30_000);
    // Some of them were on the killed instance: their sockets closed, and they came back through nginx.
    expect(clients.filter((c, i) => c.closes.length > closesBefore[i]).length).toBeGreaterThan(0);
    const stored = await storedDraftIds(await cookieOf(cluster.url, 'supervisor@example.org'));
    expect(stored).toEqual(expect.arrayContaining(relayed));
    expect(stored).toEqual(expect.arrayContaining(ids));
  }, 60_000);
});
