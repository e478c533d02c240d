// `npm run worker`: a job worker for several app servers (REDIS_URL set; docs/scaling.md). It takes
// outgoing mail, conformer, reference-matching and analysis jobs from the BullMQ queues
// (jobs/bull-queues.ts) and runs them with the same code the single server runs in process; the heavy
// work runs in worker threads as there, and progress and cancellation go through MariaDB rows. Settings
// come from the environment, as for the app servers (DATABASE_URL, REDIS_URL, SMTP_URL, …).
// Run as many as the jobs need; SIGTERM lets running jobs finish (BullMQ hands unfinished ones to
// another worker when this one dies).
import { fileURLToPath } from 'node:url';
import { Worker } from 'bullmq';
import { configFromEnv, type Config } from './config';
import { createDb, migrateLatest } from './db/knex';
import { createLogger } from './logger';
import { createMailer } from './mail/mailer';
import { startMailSink, type MailSink } from './mail/sink';
import { connectCluster } from './cluster/cluster-links';
import { DRAFT_INPUTS_TOPIC } from './cluster/invalidation-bus';
import { announceWrites } from './cache/read-cache';
import { bullConnection, QUEUES } from './jobs/bull-queues';
import type { Job } from './jobs/job-queue';
import { computeConformer } from './molecules/conformer-queue';
import { stopConformerThread } from './molecules/conformer-thread';
import { matchJobHooks, matchJobRunner, type MatchJobData } from './references/match-job';
import { analysisJobHooks, analysisJobRunner } from './analyses/analysis-job';

export interface RunningWorker {
  stop(): Promise<void>;
}

export async function startWorker(config: Config): Promise<RunningWorker> {
  if (!config.redisUrl) throw new Error('REDIS_URL is not set: without Redis the app server runs its jobs itself, and no worker is needed.');
  const log = createLogger(config.logLevel);
  const db = createDb(config.databaseUrl);
  await migrateLatest(db);
  let sink: MailSink | null = null;
  if (!config.smtpUrl) sink = await startMailSink(db);
  const mailer = createMailer(config.smtpUrl ?? (sink as MailSink).url, config.mailFrom);
  const cluster = await connectCluster(config.redisUrl, log);
  // The app servers' read caches drop their answers when a job's writes are committed (cache/read-cache.ts).
  const writes = announceWrites(db, cluster.invalidation);
  const connection = bullConnection(config.redisUrl);
  const workers: Worker[] = [
    new Worker<Job>(QUEUES.mail, async (job) => mailer.send(job.data.mail), { connection, concurrency: 4 }),
    new Worker<{ moleculeId: number }>(
      QUEUES.conformers,
      async (job) => {
        await computeConformer(db, log, job.data.moleculeId);
        // Every app server's live drafts of this molecule take its new coordinates.
        cluster.invalidation.publish(DRAFT_INPUTS_TOPIC, JSON.stringify({ moleculeId: job.data.moleculeId }));
      },
      { connection, concurrency: 1 },
    ),
  ];
  // Long jobs by kind: the runner and its hooks, built here from the job's data (background-task.ts).
  const runMatch = matchJobRunner(db, config.dataDir);
  const runAnalysis = analysisJobRunner(db, config.dataDir);
  const tasks: Record<string, (data: never) => Promise<void>> = {
    'reference-match': (data: MatchJobData) => runMatch(data, matchJobHooks(db, data.referenceId)),
    analysis: (data: Parameters<typeof runAnalysis>[0]) => runAnalysis(data, analysisJobHooks(db, data.analysisId)),
  };
  workers.push(
    new Worker(
      QUEUES.tasks,
      async (job) => {
        const run = tasks[job.name];
        if (!run) throw new Error(`no runner for the job kind ${job.name}`);
        await run(job.data as never);
      },
      { connection, concurrency: 1 },
    ),
  );
  for (const w of workers) w.on('failed', (job, err) => log.error({ err, queue: w.name, job: job?.id }, 'job failed'));
  await Promise.all(workers.map((w) => w.waitUntilReady()));
  log.info({ queues: workers.map((w) => w.name) }, 'worker ready');
  return {
    async stop() {
      await Promise.all(workers.map((w) => w.close()));
      await stopConformerThread();
      writes.stop();
      await cluster.close();
      mailer.close();
      await sink?.close();
      await db.destroy();
    },
  };
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const running = await startWorker(configFromEnv());
  const stop = () => void running.stop().then(() => process.exit(0));
  process.once('SIGINT', stop);
  process.once('SIGTERM', stop);
}
