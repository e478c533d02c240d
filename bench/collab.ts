// `npm run bench:collab`: per-edit propagation on the live-collaboration server against a bare Yjs
// relay measured in the same run, and the server's memory with many connections. Not a test: it
// prints numbers (see docs/benchmarks.md). Starts its own MariaDB in a temp dir, the Beadloom server
// as a child process (its RSS is read from /proc), and the bare relay as another child process.
import type { ChildProcess } from 'node:child_process';
import { child } from './child';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import * as Y from 'yjs';
import { WebsocketProvider } from 'y-websocket';
import WebSocket from 'ws';
import { startMariaDb } from '../scripts/lib/mariadb';
import { freePort } from '../scripts/lib/free-port';
import { randomSecret } from '../scripts/lib/secrets';
import { createDb, migrateLatest } from '../server/db/knex';
import { seedDemo } from '../seeds/demo';
import { cookieSocket, sessionCookie } from '../tests/helpers/collab-client';
import { beadsOf, createBead } from '../src/shared/mapping-doc';
import { CONFORMER_IDLE_MS } from '../server/molecules/conformer-thread';

const CLIENTS = 20;
const EDITS = 200;
const GAP_MS = 10;
const ROUNDS = 4;
const SETTLE_MS = 500;
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));


const rssMb = (pid: number) => Number(/VmRSS:\s+(\d+)/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'))![1]) / 1024;

async function until(check: () => boolean | Promise<boolean>, ms = 30_000, everyMs = 5) {
  const end = Date.now() + ms;
  while (!(await check())) {
    if (Date.now() > end) throw new Error('timed out');
    await sleep(everyMs);
  }
}

function connect(wsBase: string, room: string, cookie: string | null) {
  const doc = new Y.Doc();
  const provider = new WebsocketProvider(wsBase, room, doc, { disableBc: true, ...(cookie ? { WebSocketPolyfill: cookieSocket(cookie) as never } : { WebSocketPolyfill: WebSocket as never }) });
  // Evaluation, error and session messages are ours: take them (unparsed) instead of logging.
  for (const type of [100, 101, 102]) provider.messageHandlers[type] = () => undefined;
  return { doc, provider };
}

const summary = (xs: number[]) => ({ p50: pct(xs, 50), p95: pct(xs, 95), p99: pct(xs, 99), n: xs.length });
const pct = (xs: number[], p: number) => xs.slice().sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor((p / 100) * xs.length))];

/** 20 clients, 200 edits 10 ms apart from rotating senders; latency = send → seen by each other client. */
async function load(wsBase: string, room: string, cookies: (string | null)[]) {
  const clients = Array.from({ length: CLIENTS }, (_v, i) => connect(wsBase, room, cookies[i % cookies.length]));
  await until(() => clients.every((c) => c.provider.synced));
  if (!beadsOf(clients[0].doc).has('bench')) createBead(clients[0].doc, [0], { id: 'bench', name: 'E-1' });
  await until(() => clients.every((c) => beadsOf(c.doc).has('bench')));
  const sent = new Map<number, number>();
  const latencies: number[] = [];
  clients.forEach((c, ci) =>
    beadsOf(c.doc)
      .get('bench')!
      .observe(() => {
        const name = String(beadsOf(c.doc).get('bench')!.get('name'));
        const i = Number(name.slice(1));
        const sender = i % CLIENTS;
        if (sender !== ci && sent.has(i)) latencies.push(performance.now() - sent.get(i)!);
      }),
  );
  for (let i = 0; i < EDITS; i++) {
    const c = clients[i % CLIENTS];
    sent.set(i, performance.now());
    beadsOf(c.doc).get('bench')!.set('name', `E${i}`);
    await sleep(GAP_MS);
  }
  await until(() => latencies.length >= EDITS * (CLIENTS - 1) * 0.999, 20_000).catch(() => undefined);
  for (const c of clients) c.provider.destroy();
  return latencies;
}

const dir = mkdtempSync(join(tmpdir(), 'beadloom-bench-'));
const mariadb = await startMariaDb({ dataDir: dir, port: await freePort(), database: 'beadloom_bench', user: 'beadloom', password: randomSecret(16) });
const procs: ChildProcess[] = [];
try {
  const db = createDb(mariadb.url);
  await migrateLatest(db);
  await seedDemo(db, 12);
  const mappingId = (await db('mappings').orderBy('id').first('id')).id;
  const moleculeId = (await db('molecules').orderBy('id').first('id')).id;

  const app = await child(['--import', 'tsx', 'tests/helpers/server-child.ts'], { DATABASE_URL: mariadb.url, SESSION_SECRET: randomSecret(24), PORT: '0', LOG_LEVEL: 'silent', CLIENT_DIR: '' });
  procs.push(app.proc);
  const url = app.line.replace('localhost', '127.0.0.1');
  const cookies = [await sessionCookie(url, 'modeller@example.org'), await sessionCookie(url, 'supervisor@example.org')];
  const relay = await child(['--import', 'tsx', 'bench/bare-relay.ts'], {});
  procs.push(relay.proc);

  // The server starts conformer jobs for the demo molecules: measure once they are done (CPU), and
  // the memory once the conformer thread has stopped after its idle time (conformer-thread.ts).
  console.log('waiting for the background conformer jobs…');
  await until(async () => !(await db('molecules').whereIn('conformer_status', ['queued', 'running']).first('id')), 300_000, 250);
  const conformersDone = Date.now();

  // Warm both up once (first evaluation, JIT), then measure each in turn.
  await load(`ws://127.0.0.1:${relay.line}`, 'warm', [null]);
  await load(`${url.replace('http', 'ws')}/collab`, String(mappingId), cookies);
  // ROUNDS rounds each, pooled, in the order bare–ours, ours–bare, bare–ours, … (each server goes first
  // as often as second, so a drift of the machine or what one round leaves behind weighs on both alike),
  // with a pause after each round for its sockets to close.
  const bareLat: number[] = [];
  const oursLat: number[] = [];
  const bareRound = async () => bareLat.push(...(await load(`ws://127.0.0.1:${relay.line}`, 'bench', [null])));
  const oursRound = async () => oursLat.push(...(await load(`${url.replace('http', 'ws')}/collab`, String(mappingId), cookies)));
  for (let r = 0; r < ROUNDS; r++) {
    for (const round of r % 2 === 0 ? [bareRound, oursRound] : [oursRound, bareRound]) {
      await round();
      await sleep(SETTLE_MS);
    }
  }
  const bare = summary(bareLat);
  const ours = summary(oursLat);
  const rssAfterLoad = rssMb(app.proc.pid!);

  // 200 connections over 50 mappings.
  const ids: number[] = [];
  const token = await csrf(url, cookies[0]);
  for (let i = 0; i < 50; i++) {
    const res = await fetch(`${url}/api/molecules/${moleculeId}/mappings`, {
      method: 'POST',
      headers: { cookie: token.cookie, 'content-type': 'application/json', 'x-csrf-token': token.token },
      body: JSON.stringify({ name: `Bench ${i}`, resolution: '4:1', copyOf: mappingId }),
    });
    ids.push(((await res.json()) as { id: number }).id);
  }
  const many = ids.flatMap((id, i) => Array.from({ length: 4 }, (_v, k) => connect(`${url.replace('http', 'ws')}/collab`, String(id), cookies[(i + k) % 2])));
  await until(() => many.every((c) => c.provider.synced), 120_000);
  await sleep(Math.max(1000, conformersDone + CONFORMER_IDLE_MS + 2000 - Date.now()));
  const rss200 = rssMb(app.proc.pid!);
  for (const c of many) c.provider.destroy();
  await db.destroy();

  const row = (name: string, r: { p50: number; p95: number; p99: number; n: number }) => `| ${name} | ${r.p50.toFixed(2)} | ${r.p95.toFixed(2)} | ${r.p99.toFixed(2)} | ${r.n} |`;
  console.log(`\n${CLIENTS} clients on one mapping, ${EDITS} edits ${GAP_MS} ms apart, ${ROUNDS} rounds per server (ms from send to seen by each other client)\n`);
  console.log('| server | p50 | p95 | p99 | deliveries |\n|---|---|---|---|---|');
  console.log(row('bare relay (sync only)', bare));
  console.log(row('Beadloom collab', ours));
  console.log(`\nratio p95 Beadloom / bare: ${(ours.p95 / bare.p95).toFixed(2)} (target ≤ 1.75, the floor being the MariaDB write before relay); p99 ${ours.p99.toFixed(2)} ms (target < 25)`);
  console.log(`server RSS after the load: ${rssAfterLoad.toFixed(0)} MB; with 200 connections over 50 mappings: ${rss200.toFixed(0)} MB (target < 300)`);
} finally {
  for (const p of procs) p.kill('SIGTERM');
  await sleep(500);
  await mariadb.stop();
  rmSync(dir, { recursive: true, force: true });
}

async function csrf(url: string, cookie: string): Promise<{ token: string; cookie: string }> {
  const res = await fetch(`${url}/api/auth/csrf`, { headers: { cookie } });
  const extra = res.headers.getSetCookie().map((c) => c.split(';')[0]);
  return { token: ((await res.json()) as { token: string }).token, cookie: [cookie, ...extra].join('; ') };
}
process.exit(0);
