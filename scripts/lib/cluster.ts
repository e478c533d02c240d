// The several-servers picture on one machine (docs/scaling.md), for `npm run start:cluster`, the
// scale-out tests and `npm run bench:cluster`: N app instances (server/index.ts, each its own process
// on its own port), M job workers (server/worker.ts) and nginx in front (scripts/cluster/
// nginx.conf.template), all on one MariaDB and one Redis that the caller started. Every process is
// started in its own process group and stopped by its pid; `kill(i)` SIGKILLs one instance (tests).
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { ensureNginx } from './system-packages';

export interface ClusterOptions {
  databaseUrl: string;
  redisUrl: string;
  /** nginx listens here; instance i (from 1) on port + i. */
  port: number;
  instances: number;
  workers: number;
  /** nginx's configuration, pid, logs and temp files. */
  dir: string;
  /** More settings for the app instances and workers (SESSION_SECRET is required). */
  env: Record<string, string>;
  /** Where the children's output goes ('inherit' for start:cluster, 'ignore' in tests). */
  output?: 'inherit' | 'ignore';
}

export interface RunningCluster {
  url: string;
  instanceUrls: string[];
  /** SIGKILL instance i (0-based): it stops at once, without closing anything. */
  kill(i: number): Promise<void>;
  /** Starts instance i again (after kill). */
  restart(i: number): Promise<void>;
  /** Process ids of the app instances (null for a killed one), for memory readings. */
  instancePids(): (number | null)[];
  stop(): Promise<void>;
}

const root = resolve(import.meta.dirname, '..', '..');

export async function startCluster(options: ClusterOptions): Promise<RunningCluster> {
  const children: (ChildProcess | null)[] = [];
  const workers: ChildProcess[] = [];
  let nginx: ChildProcess | null = null;
  const instancePorts = Array.from({ length: options.instances }, (_, i) => options.port + 1 + i);
  const env = (extra: Record<string, string>) => ({ ...process.env, ...options.env, DATABASE_URL: options.databaseUrl, REDIS_URL: options.redisUrl, TRUST_PROXY: '1', ...extra });
  const launch = (i: number) => spawnNode('server/index.ts', env({ PORT: String(instancePorts[i]), APP_URL: `http://localhost:${options.port}` }), options.output ?? 'ignore');

  const stop = async () => {
    await Promise.all([nginx, ...children, ...workers].map((c) => c && ended(c, 'SIGTERM')));
  };
  try {
    for (let i = 0; i < options.instances; i++) children.push(launch(i));
    for (let i = 0; i < options.workers; i++) workers.push(spawnNode('server/worker.ts', env({}), options.output ?? 'ignore'));
    await Promise.all(instancePorts.map((p, i) => healthy(`http://127.0.0.1:${p}`, children[i]!)));
    nginx = startNginx(options);
    await healthy(`http://127.0.0.1:${options.port}`, nginx);
  } catch (err) {
    await stop();
    throw err;
  }
  return {
    url: `http://localhost:${options.port}`,
    instanceUrls: instancePorts.map((p) => `http://localhost:${p}`),
    async kill(i) {
      const c = children[i];
      children[i] = null;
      if (c) await ended(c, 'SIGKILL');
    },
    async restart(i) {
      const c = launch(i);
      children[i] = c;
      await healthy(`http://127.0.0.1:${instancePorts[i]}`, c);
    },
    instancePids: () => children.map((c) => c?.pid ?? null),
    stop,
  };
}

function spawnNode(script: string, env: NodeJS.ProcessEnv, output: 'inherit' | 'ignore'): ChildProcess {
  // node itself (with tsx's loader), not the tsx wrapper: the pid is the server's (memory, SIGKILL).
  return spawn(process.execPath, ['--import', 'tsx', script], { cwd: root, env, stdio: ['ignore', output, output], detached: true });
}

/** The nginx of the template, in the foreground (daemon off) so it is our child. */
function startNginx(options: ClusterOptions): ChildProcess {
  const dir = resolve(options.dir);
  mkdirSync(dir, { recursive: true });
  const upstreams = Array.from({ length: options.instances }, (_, i) => `    server 127.0.0.1:${options.port + 1 + i} max_fails=1 fail_timeout=2s;`).join('\n');
  const conf = readFileSync(join(root, 'scripts/cluster/nginx.conf.template'), 'utf8')
    .replaceAll('{{DIR}}', dir)
    .replaceAll('{{PORT}}', String(options.port))
    .replace('{{UPSTREAMS}}', upstreams);
  const file = join(dir, 'nginx.conf');
  writeFileSync(file, conf);
  const binary = process.env.NGINX_PATH ?? ensureNginx();
  return spawn(binary, ['-p', dir, '-c', file, '-e', join(dir, 'nginx-error.log')], { stdio: 'ignore', detached: true });
}

/** Waits until GET /api/health answers 200 (or the process exits). */
async function healthy(url: string, child: ChildProcess, ms = 60_000): Promise<void> {
  const deadline = Date.now() + ms;
  for (;;) {
    if (child.exitCode !== null || child.signalCode !== null) throw new Error(`${url}: the process exited (${child.exitCode ?? child.signalCode}) before it answered`);
    const ok = await fetch(`${url}/api/health`).then(
      (r) => r.status === 200,
      () => false,
    );
    if (ok) return;
    if (Date.now() > deadline) throw new Error(`${url} did not become healthy within ${ms / 1000} s`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** Sends `signal` to the child's process group and waits for it to exit. */
function ended(child: ChildProcess, signal: NodeJS.Signals): Promise<void> {
  if (child.exitCode !== null || child.signalCode !== null) return Promise.resolve();
  const exited = new Promise<void>((r) => child.once('exit', () => r()));
  try {
    process.kill(-child.pid!, signal);
  } catch {
    child.kill(signal);
  }
  return exited;
}
