import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import WebSocket from 'ws';
import { ROUTE_CASES } from '../api/permission-table';
import { FuzzCaller, rawRequest, startFuzzServer, type FuzzServer, type RawResponse } from './fuzz-server';
import { jsonBody, multipart, pathValue, query, rawBody, smiles, socketFrame } from './arbitraries';

// Issue 11: a bounded, seeded fuzz run over every JSON route (the route list of the permission
// table, which permissions.test.ts keeps equal to the app's), the upload route, SMILES and collab
// socket frames, against the server in its own process. It asserts 0 answers of 500 or above,
// 0 exits of the server process, and every error in the shared shape { error: { code, message } }.
// `npm test` sends about 2,000 inputs; `npm run fuzz` 20,000. FUZZ_SEED picks
// another seed; a failure prints the inputs that caused it, and the seed reproduces them.

const SCALE = Number(process.env.FUZZ_SCALE ?? 1);
const SEED = Number(process.env.FUZZ_SEED ?? 20261202);
const COUNTS = { json: 1000 * SCALE, raw: 300 * SCALE, upload: 200 * SCALE, smiles: 300 * SCALE, frames: 200 * SCALE };

let server: FuzzServer;
let callers: Record<'supervisor' | 'admin' | 'student' | 'anonymous', FuzzCaller>;
const realIds: number[] = [];
let mappingIds: number[] = [];
let projectId = 1;

interface Finding {
  what: string;
  status: number | string;
  input: string;
}
const findings: Finding[] = [];
const statuses = new Map<string, number>();
let resignIns = 0;
/** Time spent per route pattern, to see where a run goes. */
const routeMs = new Map<string, number>();

function check(area: string, what: string, res: RawResponse): void {
  const key = `${area} ${res.status}`;
  statuses.set(key, (statuses.get(key) ?? 0) + 1);
  if (res.status >= 500) findings.push({ what: `${area}: ${what}`, status: res.status, input: res.text.slice(0, 200) });
  else if (res.status >= 400) {
    const e = (res.body as { error?: { code?: unknown; message?: unknown } } | undefined)?.error;
    if (typeof e?.code !== 'string' || typeof e?.message !== 'string') findings.push({ what: `${area}: ${what} (not in the error shape)`, status: res.status, input: res.text.slice(0, 200) });
  }
}

/** Sends as `caller`; a signed-in caller whose session the input ended (sign-out, …) signs in again. */
async function send(caller: FuzzCaller, method: string, path: string, headers: Record<string, string>, body?: Buffer): Promise<RawResponse> {
  const res = await caller.send(method, path, headers, body);
  if (caller.email && res.status === 401) {
    resignIns++;
    await caller.begin();
  }
  return res;
}

/** Runs `work` over `items` in `lanes` parallel streams (the server answers several callers at once). */
async function inParallel<T>(items: T[], work: (item: T) => Promise<void>, lanes = 4): Promise<void> {
  let next = 0;
  await Promise.all(Array.from({ length: lanes }, async () => {
    while (next < items.length) await work(items[next++]);
  }));
}

const pick = <T>(arb: fc.Arbitrary<T>, n: number, offset: number): T[] => (n > 0 ? fc.sample(arb, { seed: SEED + offset, numRuns: n }) : []);

beforeAll(async () => {
  server = await startFuzzServer();
  const db = server.database.db;
  for (const table of ['projects', 'molecules', 'mappings', 'users', 'threads', 'comments', 'bead_types', 'mapping_versions', 'notifications']) {
    try {
      realIds.push(...((await db(table).pluck('id')) as number[]).slice(0, 8));
    } catch {
      // a table of another name in this version: its ids are covered by the small numbers anyway
    }
  }
  mappingIds = (await db('mappings').pluck('id')) as number[];
  projectId = ((await db('projects').orderBy('id').first('id')) as { id: number }).id;
  callers = {
    supervisor: new FuzzCaller(server.url, 'supervisor@example.org'),
    admin: new FuzzCaller(server.url, 'admin@example.org'),
    student: new FuzzCaller(server.url, 'student@example.org'),
    anonymous: new FuzzCaller(server.url, null),
  };
  for (const c of Object.values(callers)) await c.begin();
}, 120_000);

afterAll(async () => {
  await server?.stop();
});

describe('fuzzing the running server', () => {
  it(`answers ${Object.values(COUNTS).reduce((a, b) => a + b)} seeded inputs without a 5xx, an error outside the shape or a server exit`, { timeout: 300_000 * SCALE }, async () => {
    const started = Date.now();
    const phase: Record<string, number> = {};
    let mark = Date.now();
    const lap = (name: string) => {
      phase[name] = Date.now() - mark;
      mark = Date.now();
      console.log(`fuzz: ${name} done in ${phase[name]} ms`);
    };
    const callerOf = fc.constantFrom<keyof typeof callers>('supervisor', 'supervisor', 'supervisor', 'supervisor', 'student', 'admin', 'anonymous');

    // 1. Collab socket frames, as the demo modeller on real mappings (first: the HTTP inputs below
    // may remove members or mappings).
    const member = new FuzzCaller(server.url, 'modeller@example.org');
    expect(await member.begin()).toBe(true);
    let frames = 0;
    let closes = 0;
    const closeCodes = new Map<number, number>();
    let ws: WebSocket | null = null;
    let refusals = 0;
    /** A socket on one of the mappings; an upgrade the server refuses (a mapping the inputs deleted) is counted and the next tried. */
    const open = (attempt = 0): Promise<WebSocket> =>
      new Promise<WebSocket | null>((resolve, reject) => {
        const s = new WebSocket(`${server.url.replace('http', 'ws')}/collab/${mappingIds[(frames + attempt) % mappingIds.length]}`, { headers: { cookie: member.cookie } });
        s.on('open', () => resolve(s));
        s.on('unexpected-response', (_req, res) => {
          refusals++;
          if ((res.statusCode ?? 0) >= 500) findings.push({ what: 'socket upgrade answered 5xx', status: res.statusCode ?? 0, input: `mapping ${mappingIds[(frames + attempt) % mappingIds.length]}` });
          resolve(null);
        });
        s.on('error', reject);
        s.on('close', (code) => {
          closes++;
          closeCodes.set(code, (closeCodes.get(code) ?? 0) + 1);
          if (code === 1011) findings.push({ what: 'socket closed with 1011 (server error)', status: code, input: `after frame ${frames}` });
        });
      }).then((s) => {
        if (s) return s;
        if (attempt > mappingIds.length) throw new Error('every mapping refused the socket');
        return open(attempt + 1);
      });
    for (const frame of pick(socketFrame, COUNTS.frames, 5)) {
      if (!ws || ws.readyState !== WebSocket.OPEN) ws = await open();
      ws.send(frame);
      frames++;
      // The server reads frames in order: a ping answered means this frame was handled.
      const s = ws;
      await new Promise<void>((resolve) => {
        if (s.readyState !== WebSocket.OPEN) return resolve();
        const done = () => {
          s.off('pong', done);
          s.off('close', done);
          resolve();
        };
        s.on('pong', done);
        s.on('close', done);
        s.ping();
      });
    }
    ws?.close();
    lap('frames');


    // 2. Every JSON route, with near-miss bodies, path values and queries.
    const jsonCase = fc.record({ route: fc.constantFrom(...ROUTE_CASES.map((r) => ({ method: r.method, path: r.path }))), ids: fc.array(pathValue(realIds), { minLength: 3, maxLength: 3 }), body: jsonBody, query, caller: callerOf });
    await inParallel(pick(jsonCase, COUNTS.json, 1), async (c) => {
      let i = 0;
      const path = c.route.path.replace(/:[A-Za-z]+/g, () => encodeURIComponent(String(c.ids[i++ % 3])).replace(/%25/g, '%'));
      const qs = c.query ? `?${new URLSearchParams(c.query as Record<string, string>)}` : '';
      const body = c.body === undefined || c.route.method === 'get' ? undefined : Buffer.from(JSON.stringify(c.body));
      const headers: Record<string, string> = body ? { 'content-type': 'application/json', accept: 'application/json, text/event-stream' } : { accept: 'application/json, text/event-stream' };
      const t0 = Date.now();
      // Signing out is fuzzed anonymously only: a signed-in caller would just sign in again (bcrypt, slow).
      const caller = c.route.path === '/api/auth/logout' ? callers.anonymous : callers[c.caller];
      const res = await send(caller, c.route.method.toUpperCase(), path + qs, headers, body);
      const key = `${c.route.method.toUpperCase()} ${c.route.path}`;
      routeMs.set(key, (routeMs.get(key) ?? 0) + Date.now() - t0);
      if (Date.now() - t0 > 2000) console.log(`fuzz: slow ${Date.now() - t0} ms ${c.route.method.toUpperCase()} ${path}${qs} ${body?.toString().slice(0, 120)}`);
      check('json', `${c.route.method.toUpperCase()} ${path}${qs} as ${c.caller} with ${body?.toString().slice(0, 300)}`, res);
    });
    lap('json');

    // 3. Bodies as raw bytes under any content type and encoding.
    const rawCase = fc.record({ route: fc.constantFrom(...ROUTE_CASES.filter((r) => r.method !== 'get').map((r) => ({ method: r.method, path: r.path }))), id: pathValue(realIds), raw: rawBody });
    await inParallel(pick(rawCase, COUNTS.raw, 2), async (c) => {
      const path = c.route.path.replace(/:[A-Za-z]+/g, String(c.id));
      const headers: Record<string, string> = c.raw.contentType ? { 'content-type': c.raw.contentType } : {};
      if (c.raw.contentEncoding) headers['content-encoding'] = c.raw.contentEncoding;
      const res = await send(callers.supervisor, c.route.method.toUpperCase(), path, headers, Buffer.from(c.raw.bytes));
      check('raw', `${c.route.method.toUpperCase()} ${path} ${JSON.stringify(headers)} ${Buffer.from(c.raw.bytes).toString('hex').slice(0, 200)}`, res);
    });
    lap('raw');

    // The inputs above may have disabled accounts or removed members (an admin's PATCH, a
    // supervisor's DELETE with real ids): the last two phases use fresh sessions of the site admin.
    await server.database.db('users').update({ disabled_at: null });
    const uploader = new FuzzCaller(server.url, 'admin@example.org');
    expect(await uploader.begin()).toBe(true);

    // 4. Structure uploads with broken multipart bodies and files.
    await inParallel(pick(multipart, COUNTS.upload, 3), async (m) => {
      const res = await send(uploader, 'POST', `/api/projects/${projectId}/molecules/upload`, { 'content-type': m.contentType }, m.body);
      check('upload', `${m.contentType} ${JSON.stringify(m.body.toString('latin1').slice(0, 300))}`, res);
    });
    lap('upload');

    // 5. SMILES, to the preview and the preview evaluation.
    const smilesCase = fc.record({ smiles, evaluate: fc.boolean() });
    await inParallel(pick(smilesCase, COUNTS.smiles, 4), async (c) => {
      const body = c.evaluate ? { smiles: c.smiles, mapping: { beads: [{ id: 'b', name: 'B', centre: 'mass', atoms: [{ index: 0, weight: 1 }] }] } } : { smiles: c.smiles };
      const res = await send(uploader, 'POST', c.evaluate ? '/api/chem/evaluate' : '/api/chem/molecule', { 'content-type': 'application/json' }, Buffer.from(JSON.stringify(body)));
      check('smiles', JSON.stringify(c.smiles), res);
    });
    lap('smiles');

    const health = await rawRequest(server.url, 'GET', '/api/health', {});
    const summary = {
      seed: SEED,
      inputs: { ...COUNTS },
      answers: Object.fromEntries([...statuses].sort()),
      socket: { frames, closes, refusals, closeCodes: Object.fromEntries(closeCodes) },
      resignIns,
      phaseMs: phase,
      slowestRoutesMs: Object.fromEntries([...routeMs].sort((a, b) => b[1] - a[1]).slice(0, 6)),
      serverExits: server.exits(),
      findings: findings.length,
      seconds: Math.round((Date.now() - started) / 1000),
    };
    console.log(`fuzz summary: ${JSON.stringify(summary, null, 1)}`);
    if (findings.length) console.log(`first findings:\n${findings.slice(0, 15).map((f) => `${f.status} ${f.what}\n    → ${f.input}`).join('\n')}`);
    expect(health.status).toBe(200);
    expect(server.exits()).toBe(0);
    expect(findings).toEqual([]);
  });
});
