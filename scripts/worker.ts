// `npm run worker`: one BullMQ job worker (server/worker.ts) for app servers started with REDIS_URL.
// It needs DATABASE_URL and REDIS_URL (the same as the app servers'); SMTP_URL as they have it.
import { configFromEnv } from '../server/config';
import { startWorker } from '../server/worker';
import { sessionSecret } from './lib/local-db';

if (!process.env.DATABASE_URL || !process.env.REDIS_URL) {
  console.error('[beadloom] npm run worker needs DATABASE_URL and REDIS_URL (the app servers’ own). Without Redis the app server runs its jobs itself. See docs/scaling.md.');
  process.exit(2);
}
// The worker signs nothing; the setting is only required of every process that reads the config.
const worker = await startWorker(configFromEnv({ ...process.env, SESSION_SECRET: process.env.SESSION_SECRET ?? sessionSecret() }));
console.log('[beadloom] worker running; Ctrl-C stops it.');
let stopping = false;
const stop = () => {
  if (stopping) return;
  stopping = true;
  void worker.stop().then(() => process.exit(0));
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
