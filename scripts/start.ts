// `npm start`: a private MariaDB under .data/ (or the one DATABASE_URL names: then none is started),
// migrations, the demo seed (empty database only), the client build, and the app on one port (4820
// unless PORT). REDIS_URL makes this instance one of several (docs/scaling.md); without it nothing
// changes. Ctrl-C stops the app and then MariaDB. A second run reuses .data/.
import { prepareExternalDatabase, startLocalDatabase, sessionSecret } from './lib/local-db';
import { bin, run } from './lib/run';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../seeds/demo-data';
import { configFromEnv } from '../server/config';
import { startServer, type RunningServer } from '../server/index';
import { devMailMounted } from '../server/mail/dev-mail.routes';

const production = process.env.NODE_ENV === 'production';
const wantSeed = !production || process.env.BEADLOOM_SEED === '1';
const external = process.env.DATABASE_URL;
const { mariadb, seeded } = external ? { mariadb: null, seeded: await prepareExternalDatabase(external, wantSeed) } : await startLocalDatabase(wantSeed);
const databaseUrl = external ?? mariadb!.url;

let server: RunningServer | undefined;
let stopping = false;
async function stopAll(code: number) {
  if (stopping) return;
  stopping = true;
  console.log('\n[beadloom] stopping…');
  await server?.stop().catch(() => undefined);
  await mariadb?.stop();
  console.log('[beadloom] stopped.');
  process.exit(code);
}
// Ctrl-C can arrive more than once (terminal and parent both pass it on): handle it once, never die mid-shutdown.
process.on('SIGINT', () => void stopAll(0));
process.on('SIGTERM', () => void stopAll(0));

try {
  console.log('[beadloom] building the client…');
  if ((await run(bin('vite'), ['build', '--logLevel', 'warn'])) !== 0) throw new Error('The client build failed.');

  const config = configFromEnv({
    ...process.env,
    DATABASE_URL: databaseUrl,
    SESSION_SECRET: sessionSecret(),
    LOG_LEVEL: process.env.LOG_LEVEL ?? 'warn',
  });
  server = await startServer(config, process.env.HOST ?? '127.0.0.1');

  console.log(`\nBeadloom is running at ${config.appUrl}${seeded ? ' (demo data seeded)' : ''}`);
  if (external) console.log('[beadloom] Database: DATABASE_URL (no private MariaDB started).');
  if (config.redisUrl) console.log('[beadloom] REDIS_URL set: drafts, live events and access changes cross instances; heavy jobs wait for `npm run worker`.');
  if (devMailMounted(server.ctx)) console.log(`Caught e-mail: ${config.appUrl}/dev/mail (signed in as a site admin)`);
  else if (server.ctx.mailSinkInUse) console.log('[beadloom] No SMTP_URL: e-mail is caught by the local sink and not delivered; /dev/mail is off in production (BEADLOOM_DEV_MAIL=1 turns it on for admins).');
  if (wantSeed) {
    console.log(`Demo accounts (password: ${DEMO_PASSWORD}):`);
    for (const a of DEMO_ACCOUNTS) console.log(`  ${a.email.padEnd(24)} ${a.isAdmin ? 'admin' : a.role}`);
  }
  console.log('Press Ctrl-C to stop.');
} catch (err) {
  console.error(`[beadloom] ${(err as Error).message}`);
  await stopAll(1);
}
