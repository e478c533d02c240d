import { createServer, type Server } from 'node:http';
import { fileURLToPath } from 'node:url';
import { configFromEnv, type Config } from './config';
import { createDb, migrateLatest } from './db/knex';
import { createLogger } from './logger';
import { createMailer } from './mail/mailer';
import { startMailSink, type MailSink } from './mail/sink';
import { createApp } from './app';
import type { AppContext } from './context';
import { backfillModels } from './molecules/model-backfill.service';
import { createLocalAccessChanges, type AccessChanges } from './auth/access-changes';
import { createRedisAccessChanges } from './auth/redis-access-changes';
import { connectCluster } from './cluster/cluster-links';

// Starts Beadloom: database pool, mail (real SMTP or the local sink), the
// Express app, and the HTTP server. `npm start` and `npm run dev` call this
// after MariaDB is up; run directly, it reads its settings from the environment.

export interface RunningServer {
  server: Server;
  ctx: AppContext;
  url: string;
  stop(): Promise<void>;
}

export async function startServer(config: Config, host = '127.0.0.1'): Promise<RunningServer> {
  const log = createLogger(config.logLevel);
  const db = createDb(config.databaseUrl);
  await migrateLatest(db);
  let sink: MailSink | null = null;
  if (!config.smtpUrl) sink = await startMailSink(db);
  const mailer = createMailer(config.smtpUrl ?? (sink as MailSink).url, config.mailFrom);
  const cluster = await connectCluster(config.redisUrl, log);
  const onAccessError = (err: unknown) => log.error({ err }, 'access change listener failed');
  let accessChanges: AccessChanges & { close?(): void };
  if (cluster.redis) accessChanges = createRedisAccessChanges(cluster.redis, onAccessError);
  else accessChanges = createLocalAccessChanges(onAccessError);
  const ctx: AppContext = { config, db, log, mailer, mailSinkInUse: sink !== null, accessChanges, invalidation: cluster.invalidation, redis: cluster.redis };
  const built = createApp(ctx);
  const server = createServer(built.app);
  server.on('upgrade', built.collab.handleUpgrade);
  const filled = await backfillModels(db, log);
  if (filled) log.info({ molecules: filled }, 'stored models for molecules from before canonical models');
  await built.conformers.resume();
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(config.port, host, () => resolve());
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : config.port;
  return {
    server,
    ctx,
    url: `http://localhost:${port}`,
    async stop() {
      await built.collab.close();
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await built.close();
      accessChanges.close?.();
      await cluster.close();
      mailer.close();
      await sink?.close();
      await db.destroy();
    },
  };
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const running = await startServer(configFromEnv());
  running.ctx.log.info(`Beadloom listening on ${running.url}`);
  const stop = () => void running.stop().then(() => process.exit(0));
  process.once('SIGINT', stop);
  process.once('SIGTERM', stop);
}
