// `npm run start:cluster`: the several-servers picture on one machine (docs/scaling.md): the private
// MariaDB of `npm start` (.data/, migrated, demo-seeded when empty), a private redis-server (REDIS_PORT,
// else a free port), two app
// instances on PORT+1 and PORT+2, one job worker, and nginx on PORT (4820 unless PORT says otherwise)
// in front of them. It prints the URLs; Ctrl-C stops everything it started, nginx first, MariaDB last.
import { join } from 'node:path';
import { startLocalDatabase, sessionSecret } from './lib/local-db';
import { startRedis, type RunningRedis } from './lib/redis';
import { startCluster, type RunningCluster } from './lib/cluster';
import { bin, run } from './lib/run';
import { freePort } from './lib/free-port';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../seeds/demo-data';

const port = Number(process.env.PORT ?? 4820);
const { mariadb, seeded } = await startLocalDatabase(process.env.NODE_ENV !== 'production' || process.env.BEADLOOM_SEED === '1');
let redis: RunningRedis | undefined;
let cluster: RunningCluster | undefined;
let stopping = false;
async function stopAll(code: number) {
  if (stopping) return;
  stopping = true;
  console.log('\n[beadloom] stopping the cluster…');
  await cluster?.stop().catch(() => undefined);
  await redis?.stop().catch(() => undefined);
  await mariadb.stop();
  console.log('[beadloom] stopped.');
  process.exit(code);
}
process.on('SIGINT', () => void stopAll(0));
process.on('SIGTERM', () => void stopAll(0));

try {
  console.log('[beadloom] building the client…');
  if ((await run(bin('vite'), ['build', '--logLevel', 'warn'])) !== 0) throw new Error('The client build failed.');
  redis = await startRedis({ port: process.env.REDIS_PORT ? Number(process.env.REDIS_PORT) : await freePort(), dir: '.data/redis' });
  cluster = await startCluster({
    databaseUrl: mariadb.url,
    redisUrl: redis.url,
    port,
    instances: 2,
    workers: 1,
    dir: join('.data', 'nginx'),
    output: 'inherit',
    env: { SESSION_SECRET: sessionSecret(), LOG_LEVEL: process.env.LOG_LEVEL ?? 'warn', BEADLOOM_DATA_DIR: process.env.BEADLOOM_DATA_DIR ?? '.data/files' },
  });
  console.log(`\nBeadloom (cluster) is running at ${cluster.url}${seeded ? ' (demo data seeded)' : ''}`);
  console.log(`  nginx            ${cluster.url}`);
  cluster.instanceUrls.forEach((u, i) => console.log(`  app instance ${i + 1}   ${u}`));
  console.log(`  redis            ${redis.url}`);
  console.log(`  MariaDB          .data/mariadb (port ${process.env.DB_PORT ?? 4830})`);
  console.log('  worker           1 (BullMQ: mail, conformers, reference matching, analyses)');
  console.log(`Demo accounts (password: ${DEMO_PASSWORD}): ${DEMO_ACCOUNTS.map((a) => a.email).join(', ')}`);
  console.log('Press Ctrl-C to stop everything.');
} catch (err) {
  console.error(`[beadloom] ${(err as Error).message}`);
  await stopAll(1);
}
