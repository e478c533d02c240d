// `npm run bench:reads`: the capacity of one Beadloom instance for reads. 100 signed-in users (each
// its own keep-alive connection, closed loop) hit 12 read endpoints for 30 s; in the same run, the
// same load generator hits a bare Express + mysql2 endpoint doing one indexed SELECT on the same
// MariaDB (bench/bare-reads.ts). Prints requests/s, p50/p95/p99, errors, the servers' CPU per
// request, and the ratio. Not a test: see docs/benchmarks.md.
//   --seconds N (30)  --users N (100)  --warmup N (5)  --profile DIR: a CPU profile of the Beadloom
//   server's main thread over its measured window, written into DIR (bench/reads-server.ts).
//   --only REGEX: only the endpoints whose path matches (e.g. '^/api/me$' for the least work a signed-in
//   read does: session, account, router, a kept answer and the write).
import type { ChildProcess } from 'node:child_process';
import { child } from './child';
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { parseArgs } from 'node:util';
import { startMariaDb } from '../scripts/lib/mariadb';
import { freePort } from '../scripts/lib/free-port';
import { randomSecret } from '../scripts/lib/secrets';
import { createDb, migrateLatest } from '../server/db/knex';
import { hashPassword } from '../server/auth/passwords';
import { seedDemo } from '../seeds/demo';
import { DEMO_PASSWORD } from '../seeds/demo-data';
import { signInOverHttp } from '../tests/helpers/collab-client';
import { percentile, runLoad, type LoadClient, type LoadResult } from './http-load';

const { values: args } = parseArgs({ options: { seconds: { type: 'string', default: '30' }, users: { type: 'string', default: '100' }, profile: { type: 'string' }, warmup: { type: 'string', default: '5' }, only: { type: 'string' } } });
const SECONDS = Number(args.seconds);
const USERS = Number(args.users);
const WARMUP = Number(args.warmup);
const profileDir = args.profile ? resolve(args.profile) : null;
const only = args.only ? new RegExp(args.only) : null;
const BCRYPT_COST = 12;
const ROLES = ['supervisor', 'modeller', 'student'] as const;


/** User + system CPU seconds the process has used so far (/proc/<pid>/stat, clock ticks of 1/100 s). */
const cpuSeconds = (pid: number) => {
  const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
  return (Number(fields[11]) + Number(fields[12])) / 100;
};

async function measure(base: string, clients: LoadClient[], pid: number, profile = false) {
  await runLoad(base, clients, WARMUP);
  const load = loadavg()[0];
  const cpu0 = cpuSeconds(pid);
  if (profile) process.kill(pid, 'SIGUSR2');
  const r = await runLoad(base, clients, SECONDS);
  if (profile) {
    process.kill(pid, 'SIGUSR2');
    const written = Date.now();
    while (!readdirSync(profileDir!).some((f) => f.endsWith('.cpuprofile')) && Date.now() - written < 30_000) await new Promise((r) => setTimeout(r, 100));
  }
  return { r, cpuMsPerRequest: ((cpuSeconds(pid) - cpu0) * 1000) / Math.max(1, r.requests), load };
}

const dir = mkdtempSync(join(tmpdir(), 'beadloom-bench-reads-'));
const mariadb = await startMariaDb({ dataDir: dir, port: await freePort(), database: 'beadloom_bench', user: 'beadloom', password: randomSecret(16) });
const procs: ChildProcess[] = [];
try {
  const db = createDb(mariadb.url);
  await migrateLatest(db);
  await seedDemo(db, BCRYPT_COST);
  const projectId: number = (await db('projects').first('id')).id;
  const moleculeIds: number[] = (await db('molecules').orderBy('id').select('id')).map((r) => r.id);
  const mappingIds: number[] = (await db('mappings').orderBy('id').select('id')).map((r) => r.id);
  // USERS accounts in the demo project, a third each supervisor, modeller and student.
  const hash = await hashPassword(DEMO_PASSWORD, BCRYPT_COST);
  const emails = Array.from({ length: USERS }, (_v, i) => `reader${i}@example.org`);
  await db.transaction(async (trx) => {
    for (const [i, email] of emails.entries()) {
      const [id] = await trx('users').insert({ email, display_name: `Reader ${i}`, is_admin: false, password_hash: hash });
      await trx('project_members').insert({ project_id: projectId, user_id: id, role: ROLES[i % ROLES.length] });
    }
  });

  if (profileDir) mkdirSync(profileDir, { recursive: true });
  const app = await child(['--import', 'tsx', 'bench/reads-server.ts'], {
    ...(profileDir ? { BENCH_PROFILE_DIR: profileDir } : {}),
    NODE_ENV: 'production',
    DATABASE_URL: mariadb.url,
    SESSION_SECRET: randomSecret(24),
    PORT: '0',
    LOG_LEVEL: 'warn', // as npm start
    CLIENT_DIR: '',
  });
  procs.push(app.proc);
  const url = app.line.replace('localhost', '127.0.0.1');
  const bare = await child(['--import', 'tsx', 'bench/bare-reads.ts'], { DATABASE_URL: mariadb.url });
  procs.push(bare.proc);

  console.log(`signing in ${USERS} users…`);
  const sessions: { cookie: string; csrfToken: string }[] = [];
  for (let i = 0; i < emails.length; i += 4) sessions.push(...(await Promise.all(emails.slice(i, i + 4).map((e) => signInOverHttp(url, e)))));
  // A few threads, so the threads list has something to list.
  const first = await (await fetch(`${url}/api/mappings/${mappingIds[0]}`, { headers: { cookie: sessions[1].cookie } })).json();
  for (let t = 0; t < 6; t++) {
    const bead = first.draft.beads[t % first.draft.beads.length].id;
    const res = await fetch(`${url}/api/mappings/${mappingIds[0]}/threads`, {
      method: 'POST',
      headers: { cookie: sessions[1].cookie, 'content-type': 'application/json', 'x-csrf-token': sessions[1].csrfToken },
      body: JSON.stringify({ beadId: bead, body: `Bench thread ${t}: is this bead's type right?` }),
    });
    if (res.status !== 201) throw new Error(`creating a thread: ${res.status} ${await res.text()}`);
  }

  const paths = (n: number, u: number): string => {
    const mol = moleculeIds[(n + u) % moleculeIds.length];
    const map = mappingIds[(n + u) % mappingIds.length];
    const list = [
      '/api/me',
      '/api/projects',
      `/api/projects/${projectId}`,
      `/api/projects/${projectId}/members`,
      `/api/projects/${projectId}/molecules`,
      `/api/projects/${projectId}/bead-types`,
      `/api/molecules/${mol}`,
      `/api/molecules/${mol}/mappings`,
      `/api/mappings/${map}`,
      `/api/mappings/${map}/threads`,
      `/api/mappings/${map}/versions`,
      '/api/notifications',
    ];
    const chosen = only ? list.filter((p) => only.test(p)) : list;
    if (!chosen.length) throw new Error(`--only ${args.only} matches none of the endpoints`);
    return chosen[(n + u) % chosen.length];
  };
  const ours: LoadClient[] = sessions.map((s, u) => ({ headers: { cookie: s.cookie }, path: (n) => paths(n, u) }));
  const userIds: number[] = (await db('users').select('id')).map((r) => r.id);
  const reference: LoadClient[] = sessions.map((_s, u) => ({ headers: {}, path: (n) => `/users/${userIds[(n + u) % userIds.length]}` }));
  await db.destroy();

  console.log(`measuring: ${WARMUP} s warm-up, then ${SECONDS} s, ${USERS} users, on each server…`);
  const b = await measure(`http://127.0.0.1:${bare.line}`, reference, bare.proc.pid!);
  const o = await measure(url, ours, app.proc.pid!, profileDir !== null);

  const rps = (r: LoadResult) => r.requests / r.seconds;
  const row = (name: string, m: { r: LoadResult; cpuMsPerRequest: number; load: number }) =>
    `| ${name} | ${rps(m.r).toFixed(0)} | ${percentile(m.r.latencies, 50).toFixed(1)} | ${percentile(m.r.latencies, 95).toFixed(1)} | ${percentile(m.r.latencies, 99).toFixed(1)} | ${m.r.errors} | ${m.cpuMsPerRequest.toFixed(2)} | ${m.load.toFixed(1)} |`;
  console.log(`\n${USERS} signed-in users, closed loop, ${SECONDS} s (times in ms)\n`);
  console.log('| server | requests/s | p50 | p95 | p99 | errors | server CPU ms / request | load average at start |\n|---|---:|---:|---:|---:|---:|---:|---:|');
  console.log(row('bare Express + mysql2, one indexed SELECT', b));
  console.log(row(only ? `Beadloom, endpoints matching ${args.only}` : 'Beadloom, 12 read endpoints', o));
  console.log('\n| Beadloom endpoint | requests | p50 | p99 |\n|---|---:|---:|---:|');
  for (const [path, xs] of [...o.r.byLabel].sort()) console.log(`| ${path} | ${xs.length} | ${percentile(xs, 50).toFixed(1)} | ${percentile(xs, 99).toFixed(1)} |`);
  if (o.r.firstError || b.r.firstError) console.log(`\nfirst error: Beadloom ${o.r.firstError ?? '—'}; bare ${b.r.firstError ?? '—'}`);
  const ratio = rps(o.r) / rps(b.r);
  const p99 = percentile(o.r.latencies, 99);
  console.log(`\nthroughput Beadloom / bare: ${ratio.toFixed(2)} (target ≥ 0.5); Beadloom p99 ${p99.toFixed(1)} ms (target < 100); load average now ${loadavg().map((l) => l.toFixed(1)).join(' ')}`);
} finally {
  for (const p of procs) p.kill('SIGTERM');
  await Promise.all(procs.map((p) => (p.exitCode !== null ? null : new Promise((r) => p.once('exit', r)))));
  await mariadb.stop();
  rmSync(dir, { recursive: true, force: true });
}
process.exit(0);
