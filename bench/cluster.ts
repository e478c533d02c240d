// `npm run bench:cluster`: the collab bench's load (20 clients on one mapping, 200 edits 10 ms apart,
// rotating senders) on one Beadloom instance without Redis and, in the same run, on two instances
// behind Redis with the clients split between them; then 400 clients on 100 mappings over the two
// instances and each instance's memory. Not a test: it prints numbers (docs/benchmarks.md). Starts
// its own MariaDB (temp dir), redis-server, the two instances + a worker (scripts/lib/cluster.ts) and
// the single instance (tests/helpers/server-child.ts), each a process of its own.
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import * as Y from 'yjs';
import { WebsocketProvider } from 'y-websocket';
import knexFactory from 'knex';
import { startMariaDb } from '../scripts/lib/mariadb';
import { startRedis } from '../scripts/lib/redis';
import { startCluster } from '../scripts/lib/cluster';
import { freePort } from '../scripts/lib/free-port';
import { randomSecret } from '../scripts/lib/secrets';
import { createDb, migrateLatest } from '../server/db/knex';
import { seedDemo } from '../seeds/demo';
import { cookieSocket, sessionCookie } from '../tests/helpers/collab-client';
import { beadsOf, createBead } from '../src/shared/mapping-doc';

const CLIENTS = 20;
const EDITS = 200;
const GAP_MS = 10;
const ROUNDS = 4;
const MAPPINGS = 100;
const PER_MAPPING = 4;
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const rssMb = (pid: number) => Number(/VmRSS:\s+(\d+)/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'))![1]) / 1024;
const summary = (xs: number[]) => ({ p50: pct(xs, 50), p95: pct(xs, 95), p99: pct(xs, 99), n: xs.length });
const pct = (xs: number[], p: number) => xs.slice().sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor((p / 100) * xs.length))];

async function until(check: () => boolean | Promise<boolean>, ms = 30_000, everyMs = 5) {
  const end = Date.now() + ms;
  while (!(await check())) {
    if (Date.now() > end) throw new Error('timed out');
    await sleep(everyMs);
  }
}

function connect(base: string, mappingId: number, cookie: string) {
  const doc = new Y.Doc();
  const provider = new WebsocketProvider(`${base.replace('http', 'ws')}/collab`, String(mappingId), doc, { disableBc: true, WebSocketPolyfill: cookieSocket(cookie) as never });
  for (const type of [100, 101, 102]) provider.messageHandlers[type] = () => undefined;
  return { doc, provider };
}

/**
 * The ids of the structs an update carries, as "client:clock" for each clock they cover. A delivery is
 * counted when the update holding the edit's own struct arrives, whatever became of its content: edits
 * 10 ms apart rename the same bead, so the server may relay an edit already overwritten (its content
 * deleted) and a client may get two in one update. Counting what the bead's name became (an earlier
 * version of this bench) or the names an update carries missed those deliveries, though no edit was
 * lost (the state-vector check below).
 */
function structIds(update: Uint8Array): string[] {
  const ids: string[] = [];
  for (const s of Y.decodeUpdate(update).structs) for (let c = s.id.clock; c < s.id.clock + s.length; c++) ids.push(`${s.id.client}:${c}`);
  return ids;
}

/**
 * The collab bench's load. Client i connects to bases[i % bases.length]; a delivery counts as "cross"
 * when sender and receiver are on different bases. Returns the latencies (send → the update holding
 * the edit applied at the receiver) of all deliveries and of the cross-instance ones, how many were
 * expected, and how many edits some client still lacks at the end (`lost`: its document's state
 * vector is behind the sender's — a lost relayed edit, not a counting gap).
 */
async function load(bases: string[], mappingId: number, cookies: string[]) {
  const clients = Array.from({ length: CLIENTS }, (_v, i) => ({ ...connect(bases[i % bases.length], mappingId, cookies[i % cookies.length]), base: i % bases.length, seen: new Set<number>() }));
  await until(() => clients.every((c) => c.provider.synced));
  if (!beadsOf(clients[0].doc).has('bench')) createBead(clients[0].doc, [0], { id: 'bench', name: 'E-1' });
  await until(() => clients.every((c) => beadsOf(c.doc).has('bench')));
  const sent = new Map<number, number>();
  /** Edit i by the id of the struct it made ("client:clock"). */
  const editOf = new Map<string, number>();
  const all: number[] = [];
  const cross: number[] = [];
  clients.forEach((c, ci) =>
    c.doc.on('update', (update: Uint8Array, origin: unknown) => {
      if (origin !== c.provider) return; // this client's own edit
      const now = performance.now();
      for (const id of structIds(update)) {
        const i = editOf.get(id);
        if (i === undefined) continue;
        const sender = i % CLIENTS;
        if (sender === ci || c.seen.has(i)) continue;
        c.seen.add(i);
        all.push(now - sent.get(i)!);
        if (clients[sender].base !== c.base) cross.push(now - sent.get(i)!);
      }
    }),
  );
  // Each sender's clock after its last edit: a receiver whose state vector is behind it lacks an edit.
  const clockAfter = new Map<number, number>();
  for (let i = 0; i < EDITS; i++) {
    const sender = clients[i % CLIENTS];
    editOf.set(`${sender.doc.clientID}:${Y.getState(sender.doc.store, sender.doc.clientID)}`, i);
    sent.set(i, performance.now());
    beadsOf(sender.doc).get('bench')!.set('name', `E${i}`);
    clockAfter.set(sender.doc.clientID, Y.decodeStateVector(Y.encodeStateVector(sender.doc)).get(sender.doc.clientID)!);
    await sleep(GAP_MS);
  }
  const expected = EDITS * (CLIENTS - 1);
  await until(() => all.length >= expected, 20_000).catch(() => undefined);
  const lost = clients.reduce((n, c) => {
    const sv = Y.decodeStateVector(Y.encodeStateVector(c.doc));
    return n + [...clockAfter].filter(([id, clock]) => id !== c.doc.clientID && (sv.get(id) ?? 0) < clock).length;
  }, 0);
  for (const c of clients) c.provider.destroy();
  return { all, cross, expected, lost };
}

function child(args: string[], env: NodeJS.ProcessEnv): Promise<{ proc: ChildProcess; url: string }> {
  const proc = spawn(process.execPath, ['--import', 'tsx', ...args], { env: { ...process.env, ...env }, stdio: ['ignore', 'pipe', 'inherit'] });
  return new Promise((resolve, reject) => {
    let out = '';
    proc.stdout!.on('data', (c) => {
      out += c;
      const m = /READY (\S+)/.exec(out);
      if (m) resolve({ proc, url: m[1].replace('localhost', '127.0.0.1') });
    });
    proc.once('exit', (code) => reject(new Error(`${args[0]} exited with ${code}`)));
  });
}

const dir = mkdtempSync(join(tmpdir(), 'beadloom-bench-cluster-'));
const mariadb = await startMariaDb({ dataDir: join(dir, 'db'), port: await freePort(), database: 'beadloom_bench', user: 'beadloom', password: randomSecret(16) });
const redis = await startRedis({ port: await freePort(), dir: join(dir, 'redis') });
const stops: (() => Promise<unknown>)[] = [];
try {
  // Two databases in the one MariaDB: the cluster's and the single instance's (so neither sees the other's rooms).
  const singleUrl = mariadb.url.replace('/beadloom_bench', '/beadloom_single');
  const admin = knexFactory({ client: 'mysql2', connection: { uri: mariadb.url } as never });
  await admin.raw('CREATE DATABASE beadloom_single CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci');
  await admin.destroy();
  const secret = randomSecret(24);
  const dbs = [createDb(mariadb.url), createDb(singleUrl)];
  for (const db of dbs) {
    await migrateLatest(db);
    await seedDemo(db, 12);
  }
  const [clusterDb, singleDb] = dbs;
  const firstMapping = async (db: typeof clusterDb) => (await db('mappings').orderBy('id').first('id')).id as number;
  // The demo molecules' conformer jobs run first (a worker, and the single instance's own queue): measure after.
  const cluster = await startCluster({ databaseUrl: mariadb.url, redisUrl: redis.url, port: await freePort(), instances: 2, workers: 1, dir: join(dir, 'nginx'), env: { SESSION_SECRET: secret, LOG_LEVEL: 'silent', CLIENT_DIR: join(dir, 'none'), BEADLOOM_DATA_DIR: join(dir, 'files') } });
  stops.push(() => cluster.stop());
  const single = await child(['tests/helpers/server-child.ts'], { DATABASE_URL: singleUrl, SESSION_SECRET: secret, PORT: '0', LOG_LEVEL: 'silent', CLIENT_DIR: '' });
  stops.push(async () => single.proc.kill('SIGTERM'));
  console.log('waiting for the background conformer jobs…');
  for (const db of dbs) await until(async () => !(await db('molecules').whereIn('conformer_status', ['queued', 'running']).first('id')), 300_000, 250);

  const [A, B] = cluster.instanceUrls.map((u) => u.replace('localhost', '127.0.0.1'));
  const clusterCookies = [await sessionCookie(A, 'modeller@example.org'), await sessionCookie(B, 'supervisor@example.org')];
  const singleCookies = [await sessionCookie(single.url, 'modeller@example.org'), await sessionCookie(single.url, 'supervisor@example.org')];
  const clusterMapping = await firstMapping(clusterDb);
  const singleMapping = await firstMapping(singleDb);
  const one = () => load([single.url], singleMapping, singleCookies);
  const two = () => load([A, B], clusterMapping, clusterCookies);
  await one(); // warm-up (first evaluation, JIT) of both
  await two();
  const singleLat: number[] = [];
  const clusterAll: number[] = [];
  const clusterCross: number[] = [];
  // Deliveries expected and edits some receiver still lacked at the end, per setting.
  const tally = { one: { expected: 0, lost: 0 }, two: { expected: 0, lost: 0 } };
  const loadBefore = loadavg()[0];
  for (let r = 0; r < ROUNDS; r++) {
    for (const which of r % 2 === 0 ? (['one', 'two'] as const) : (['two', 'one'] as const)) {
      const round = await (which === 'one' ? one() : two());
      tally[which].expected += round.expected;
      tally[which].lost += round.lost;
      if (which === 'one') singleLat.push(...round.all);
      else {
        clusterAll.push(...round.all);
        clusterCross.push(...round.cross);
      }
      await sleep(500);
    }
  }
  const loadAfter = loadavg()[0];

  // 400 clients on 100 mappings over the two instances.
  const ids: number[] = [];
  const moleculeId = (await clusterDb('molecules').orderBy('id').first('id')).id;
  const csrfRes = await fetch(`${A}/api/auth/csrf`, { headers: { cookie: clusterCookies[0] } });
  const cookie = [clusterCookies[0], ...csrfRes.headers.getSetCookie().map((c) => c.split(';')[0])].join('; ');
  const token = ((await csrfRes.json()) as { token: string }).token;
  for (let i = 0; i < MAPPINGS; i++) {
    const res = await fetch(`${A}/api/molecules/${moleculeId}/mappings`, { method: 'POST', headers: { cookie, 'content-type': 'application/json', 'x-csrf-token': token }, body: JSON.stringify({ name: `Bench ${i}`, resolution: '4:1', copyOf: clusterMapping }) });
    ids.push(((await res.json()) as { id: number }).id);
  }
  const rssBefore = cluster.instancePids().map((p) => rssMb(p!));
  const started = performance.now();
  const many = ids.flatMap((id, i) => Array.from({ length: PER_MAPPING }, (_v, k) => connect([A, B][(i + k) % 2], id, clusterCookies[(i + k) % 2])));
  await until(() => many.every((c) => c.provider.synced), 180_000);
  const syncedMs = performance.now() - started;
  // One edit per mapping, seen by its other three clients (two on each instance).
  const editStart = performance.now();
  many.forEach((c, i) => i % PER_MAPPING === 0 && createBead(c.doc, [1], { id: 'many' }));
  await until(() => many.every((c) => beadsOf(c.doc).has('many')), 60_000);
  const editMs = performance.now() - editStart;
  await sleep(3000);
  const rss400 = cluster.instancePids().map((p) => rssMb(p!));
  for (const c of many) c.provider.destroy();
  for (const db of dbs) await db.destroy();

  const row = (name: string, r: ReturnType<typeof summary>) => `| ${name} | ${r.p50.toFixed(2)} | ${r.p95.toFixed(2)} | ${r.p99.toFixed(2)} | ${r.n} |`;
  const s1 = summary(singleLat);
  const cx = summary(clusterCross);
  console.log(`\n${CLIENTS} clients on one mapping, ${EDITS} edits ${GAP_MS} ms apart, ${ROUNDS} rounds each (ms from send to seen by each other client); load average ${loadBefore.toFixed(2)} before, ${loadAfter.toFixed(2)} after\n`);
  console.log('| setting | p50 | p95 | p99 | deliveries |\n|---|---|---|---|---|');
  console.log(row('one instance, no Redis', s1));
  console.log(row('two instances + Redis, all deliveries', summary(clusterAll)));
  console.log(row('two instances + Redis, cross-instance deliveries', cx));
  console.log(`\ndeliveries expected: ${tally.one.expected} (one instance), ${tally.two.expected} (two instances); receiver–sender pairs where the receiver still lacked an edit at the end (lost edits): ${tally.one.lost} and ${tally.two.lost}`);
  console.log(`ratio cross-instance p95 / single-instance p95: ${(cx.p95 / s1.p95).toFixed(2)} (target ≤ 2)`);
  console.log(`${MAPPINGS * PER_MAPPING} clients on ${MAPPINGS} mappings over two instances: all synced in ${(syncedMs / 1000).toFixed(1)} s; one edit per mapping seen by all in ${editMs.toFixed(0)} ms`);
  console.log(`instance RSS (MB) before: ${rssBefore.map((m) => m.toFixed(0)).join(', ')}; with the 400 clients: ${rss400.map((m) => m.toFixed(0)).join(', ')}; load average now ${loadavg()[0].toFixed(2)}`);
} finally {
  for (const stop of stops.reverse()) await stop().catch(() => undefined);
  await redis.stop();
  await mariadb.stop();
  rmSync(dir, { recursive: true, force: true });
}
process.exit(0);
