// Installs Debian packages the project needs when their binaries are absent.
// Runs apt-get as the current user (root on the project's machines).
import { existsSync } from 'node:fs';
import { spawnSync } from 'node:child_process';

let aptUpdated = false;

export function findBinary(names: string[], dirs = ['/usr/sbin', '/usr/bin', '/usr/local/sbin', '/usr/local/bin']): string | null {
  for (const name of names) {
    for (const dir of dirs) {
      const candidate = `${dir}/${name}`;
      if (existsSync(candidate)) return candidate;
    }
  }
  return null;
}

export function ensureDebianPackage(pkg: string, binaries: string[]): string {
  const found = findBinary(binaries);
  if (found) return found;
  console.log(`[beadloom] installing Debian package ${pkg} (apt-get)…`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  if (!aptUpdated) {
    run('apt-get', ['update', '-qq'], env);
    aptUpdated = true;
  }
  run('apt-get', ['install', '-y', '-qq', '--no-install-recommends', pkg], env);
  const installed = findBinary(binaries);
  if (!installed) throw new Error(`apt-get installed ${pkg} but none of ${binaries.join(', ')} was found.`);
  return installed;
}

function run(cmd: string, args: string[], env: NodeJS.ProcessEnv): void {
  const result = spawnSync(cmd, args, { stdio: ['ignore', 'inherit', 'inherit'], env });
  if (result.status !== 0) {
    throw new Error(`${cmd} ${args.join(' ')} failed (exit ${result.status}). Installing needs root and Debian's package archive.`);
  }
}

export function ensureMariaDbServer(): { mariadbd: string; installDb: string; client: string } {
  const mariadbd = ensureDebianPackage('mariadb-server', ['mariadbd', 'mysqld']);
  const installDb = findBinary(['mariadb-install-db', 'mysql_install_db']);
  const client = findBinary(['mariadb', 'mysql']);
  if (!installDb || !client) throw new Error('mariadb-server is installed but mariadb-install-db or the mariadb client is missing.');
  return { mariadbd, installDb, client };
}

export function ensureChromium(): string {
  return ensureDebianPackage('chromium', ['chromium']);
}

/** GROMACS's `gmx` (grompp, trjconv, traj): the reference-trajectory and export tests compare with it. */
export function ensureGromacs(): string {
  return ensureDebianPackage('gromacs', ['gmx', 'gmx_d']);
}

/** LAMMPS's `lmp`: the export tests run the exported data file and input script. */
export function ensureLammps(): string {
  return ensureDebianPackage('lammps', ['lmp', 'lmp_serial', 'lmp_stable']);
}

/** Redis for the scale-out tests and `npm run start:cluster`. */
export function ensureRedisServer(): string {
  return ensureDebianPackage('redis-server', ['redis-server']);
}

/** nginx, the load balancer in front of two app instances in the scale-out tests and `start:cluster`. */
export function ensureNginx(): string {
  return ensureDebianPackage('nginx', ['nginx']);
}
