#!/usr/bin/env node
// Entry point of every npm script that needs the project's dependencies.
// Plain JavaScript on purpose: it must run before node_modules exists.
// It installs npm dependencies when node_modules is absent or out of date
// (compared by a hash of package-lock.json), then hands over to the
// TypeScript script named by the first argument, run with tsx.
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { spawn, spawnSync } from 'node:child_process';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const stamp = join(root, 'node_modules', '.beadloom-lock-hash');
const lockFile = join(root, 'package-lock.json');

function lockHash() {
  const lock = existsSync(lockFile) ? readFileSync(lockFile) : Buffer.from('');
  // Only the dependency fields of package.json count: editing a script must not reinstall.
  const pkg = JSON.parse(readFileSync(join(root, 'package.json'), 'utf8'));
  const deps = JSON.stringify([pkg.dependencies, pkg.devDependencies, pkg.optionalDependencies, pkg.overrides]);
  return createHash('sha256').update(lock).update(deps).digest('hex');
}

const upToDate = (wanted) =>
  existsSync(join(root, 'node_modules', '.bin', 'tsx')) && existsSync(stamp) && readFileSync(stamp, 'utf8').trim() === wanted;

// Two commands started at once in one checkout (npm start and npm test) must not both run npm ci:
// the second would empty node_modules under the first. A directory is the lock (mkdir is atomic);
// one older than ten minutes is left over from a killed run and is taken over.
const installLock = join(root, '.install-lock');
function withInstallLock(work) {
  for (;;) {
    try {
      mkdirSync(installLock);
      break;
    } catch {
      if (Date.now() - statSync(installLock, { throwIfNoEntry: false })?.mtimeMs > 10 * 60_000) rmSync(installLock, { recursive: true, force: true });
      else Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, 500);
    }
  }
  try {
    work();
  } finally {
    rmSync(installLock, { recursive: true, force: true });
  }
}

function ensureDependencies() {
  const wanted = lockHash();
  if (upToDate(wanted)) return;
  withInstallLock(() => {
    if (!upToDate(wanted)) install(wanted);
  });
}

function install(wanted) {
  const args = existsSync(lockFile) ? ['ci', '--no-audit', '--no-fund'] : ['install', '--no-audit', '--no-fund'];
  console.log(`[beadloom] installing npm dependencies (npm ${args[0]})…`);
  const result = spawnSync('npm', args, { cwd: root, stdio: 'inherit' });
  if (result.status !== 0) {
    console.error('[beadloom] npm could not install the dependencies; see the messages above.');
    process.exit(result.status ?? 1);
  }
  writeFileSync(stamp, wanted);
}

const [command, ...rest] = process.argv.slice(2);
const scripts = { start: 'scripts/start.ts', test: 'scripts/test.ts', dev: 'scripts/dev.ts', bench: 'scripts/bench.ts', worker: 'scripts/worker.ts', 'start-cluster': 'scripts/start-cluster.ts' };
if (!command || !(command in scripts)) {
  console.error(`usage: bootstrap.mjs ${Object.keys(scripts).join('|')} [args…]`);
  process.exit(2);
}

ensureDependencies();
const child = spawn(join(root, 'node_modules', '.bin', 'tsx'), [scripts[command], ...rest], {
  cwd: root,
  stdio: 'inherit',
});
// The child gets Ctrl-C from the terminal itself and shuts down in order;
// this process only waits for it so the exit code is passed on.
for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP']) {
  process.on(signal, () => child.kill(signal));
}
child.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
