// A private redis-server (Debian's, installed when absent): loopback only, a port of our choosing, no
// persistence (the truth is in MariaDB; Redis holds channels, leases, counters and queued jobs), in
// its own process group so Ctrl-C reaches our script first. `npm run start:cluster` and the scale-out
// tests use it; tests restart it on the same port to check that instances resubscribe and catch up.
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdirSync } from 'node:fs';
import { ensureRedisServer } from './system-packages';

export interface RunningRedis {
  url: string;
  port: number;
  stop(): Promise<void>;
  /** Stops it and starts it again on the same port (everything it held is gone). */
  restart(): Promise<void>;
}

export async function startRedis(options: { port: number; dir: string; binary?: string }): Promise<RunningRedis> {
  const binary = options.binary ?? process.env.REDIS_SERVER_PATH ?? ensureRedisServer();
  mkdirSync(options.dir, { recursive: true });
  let child = await launch(binary, options.port, options.dir);
  const stop = async () => {
    const c = child;
    if (c.exitCode !== null || c.signalCode !== null) return;
    const exited = new Promise<void>((resolve) => c.once('exit', () => resolve()));
    c.kill('SIGTERM');
    await exited;
  };
  return {
    url: `redis://127.0.0.1:${options.port}`,
    port: options.port,
    stop,
    async restart() {
      await stop();
      child = await launch(binary, options.port, options.dir);
    },
  };
}

function launch(binary: string, port: number, dir: string): Promise<ChildProcess> {
  const args = ['--port', String(port), '--bind', '127.0.0.1', '--dir', dir, '--save', '', '--appendonly', 'no', '--protected-mode', 'yes', '--loglevel', 'notice'];
  const child = spawn(binary, args, { stdio: ['ignore', 'pipe', 'pipe'], detached: true });
  return new Promise((resolve, reject) => {
    let output = '';
    const onData = (chunk: Buffer) => {
      output += chunk.toString();
      if (/Ready to accept connections/.test(output)) {
        child.stdout?.off('data', onData);
        child.stdout?.resume();
        child.stderr?.resume();
        resolve(child);
      }
    };
    child.stdout?.on('data', onData);
    child.stderr?.on('data', (c: Buffer) => (output += c.toString()));
    child.once('exit', (code) => reject(new Error(`redis-server exited (${code}) before it was ready: ${output.slice(-500)}`)));
    child.once('error', reject);
  });
}
