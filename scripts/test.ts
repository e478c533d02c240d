// `npm test`: the linters (`npm run lint`), a throwaway MariaDB on a free port in a temp dir, the client
// build (the browser tests serve it), then every suite with vitest: unit, API and collab
// first, then the browser tests. MariaDB stops and the temp dir goes, pass or fail. GROMACS, LAMMPS,
// redis-server and nginx are installed from Debian when absent; their paths reach the tests as
// GMX_PATH, LMP_PATH, REDIS_SERVER_PATH and NGINX_PATH.
// Extra arguments go to vitest, e.g. `npm test -- --project unit`; such a partial run skips the
// linters (run `npm run lint` yourself, or set BEADLOOM_LINT=1).
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { startMariaDb } from './lib/mariadb';
import { ensureChromium, ensureGromacs, ensureLammps, ensureNginx, ensureRedisServer } from './lib/system-packages';
import { freePort } from './lib/free-port';
import { randomSecret } from './lib/secrets';
import { bin, run } from './lib/run';

const args = process.argv.slice(2);
// The linters first: they need no database, and a failure should not wait for the test suites.
if (args.length === 0 || process.env.BEADLOOM_LINT === '1') {
  console.log('[beadloom] linting (npm run lint)…');
  if ((await run('npm', ['run', '--silent', 'lint'])) !== 0) {
    console.error('[beadloom] npm run lint failed (see the messages above); no tests were run. Fix the findings and run npm test again.');
    process.exit(1);
  }
}
const chromium = ensureChromium();
// The simulation engines (exports and reference trajectories are checked by running them) and the
// scale-out parts (Redis, nginx); each is installed from Debian when its binary is absent.
const engines = { GMX_PATH: ensureGromacs(), LMP_PATH: ensureLammps(), REDIS_SERVER_PATH: ensureRedisServer(), NGINX_PATH: ensureNginx() };
const dir = mkdtempSync(join(tmpdir(), 'beadloom-test-'));
const mariadb = await startMariaDb({ dataDir: dir, port: await freePort(), database: 'beadloom_test', user: 'beadloom', password: randomSecret(16) });

async function cleanUp(code: number): Promise<never> {
  await mariadb.stop();
  rmSync(dir, { recursive: true, force: true });
  process.exit(code);
}
process.on('SIGINT', () => void cleanUp(130));
process.on('SIGTERM', () => void cleanUp(143));

let code = 1;
try {
  const wantsBrowser = args.length === 0 || args.some((a) => a.includes('e2e'));
  if (wantsBrowser && process.env.BEADLOOM_SKIP_BUILD !== '1') {
    console.log('[beadloom] building the client for the browser tests…');
    code = await run(bin('vite'), ['build', '--logLevel', 'warn']);
    if (code !== 0) throw new Error('The client build failed.');
  }
  const env = { ...process.env, TEST_DATABASE_URL: mariadb.url, CHROMIUM_PATH: chromium, ...engines, NODE_ENV: 'test' };
  if (args.length > 0) {
    code = await run(bin('vitest'), ['run', ...args], env);
  } else {
    // The browser tests run after the rest, with the machine to themselves: beside the API suites
    // on two cores their waits for the page would race the CPU, not the code.
    const first = await run(bin('vitest'), ['run', '--project', 'unit', '--project', 'api'], env);
    const browser = await run(bin('vitest'), ['run', '--project', 'e2e'], env);
    code = first !== 0 ? first : browser;
  }
} catch (err) {
  console.error(`[beadloom] ${(err as Error).message}`);
}
await cleanUp(code);
