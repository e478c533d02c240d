// `npm start`: a private MariaDB under .data/, migrations, the demo seed (empty
// database only), the client build, and the app on one port (4820 unless PORT).
// Ctrl-C stops the app and then MariaDB. A second run reuses .data/.
import { startMariaDb } from './lib/mariadb';
import { persistentSecret } from './lib/secrets';
import { bin, run } from './lib/run';
import { createDb, migrateLatest } from '../server/db/knex';
import { seedDemo } from '../seeds/demo';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../seeds/demo-data';
import { configFromEnv } from '../server/config';
import { startServer } from '../server/index';

const production = process.env.NODE_ENV === 'production';
const mariadb = await startMariaDb({
  dataDir: '.data/mariadb',
  port: Number(process.env.DB_PORT ?? 4830),
  database: 'beadloom',
  user: 'beadloom',
  password: persistentSecret('.data/db-password'),
});

let stopping = false;
async function stopAll(code: number, server?: { stop(): Promise<void> }) {
  if (stopping) return;
  stopping = true;
  console.log('\n[beadloom] stopping…');
  await server?.stop().catch(() => undefined);
  await mariadb.stop();
  console.log('[beadloom] stopped.');
  process.exit(code);
}
process.on('SIGINT', () => void stopAll(0));
process.on('SIGTERM', () => void stopAll(0));

try {
  const db = createDb(mariadb.url);
  await migrateLatest(db);
  const wantSeed = !production || process.env.BEADLOOM_SEED === '1';
  const seeded = wantSeed && (await seedDemo(db, 12));
  await db.destroy();

  console.log('[beadloom] building the client…');
  if ((await run(bin('vite'), ['build', '--logLevel', 'warn'])) !== 0) throw new Error('The client build failed.');

  const config = configFromEnv({
    ...process.env,
    DATABASE_URL: mariadb.url,
    SESSION_SECRET: process.env.SESSION_SECRET ?? persistentSecret('.data/session-secret', 48),
    LOG_LEVEL: process.env.LOG_LEVEL ?? 'warn',
  });
  const server = await startServer(config, process.env.HOST ?? '127.0.0.1');
  process.removeAllListeners('SIGINT');
  process.removeAllListeners('SIGTERM');
  process.on('SIGINT', () => void stopAll(0, server));
  process.on('SIGTERM', () => void stopAll(0, server));

  console.log(`\nBeadloom is running at ${config.appUrl}${seeded ? ' (demo data seeded)' : ''}`);
  if (server.ctx.mailSinkInUse) console.log(`Caught e-mail: ${config.appUrl}/dev/mail`);
  if (wantSeed) {
    console.log(`Demo accounts (password: ${DEMO_PASSWORD}):`);
    for (const a of DEMO_ACCOUNTS) console.log(`  ${a.email.padEnd(24)} ${a.isAdmin ? 'admin' : a.role}`);
  }
  console.log('Press Ctrl-C to stop.');
} catch (err) {
  console.error(`[beadloom] ${(err as Error).message}`);
  await stopAll(1);
}
