import express, { type Express } from 'express';
import helmet from 'helmet';
import cookieParser from 'cookie-parser';
import { pinoHttp } from 'pino-http';
import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import type { AppContext } from './context';
import { RouteTable, type RouteEntry } from './http/route-table';
import { errorMiddleware, unknownRoute } from './http/error-middleware';
import { requireJson } from './http/require-json';
import { securityHeaders } from './http/security-headers';
import { setChemJobTimeout } from './workers/chem-limits';
import { createSessionMiddleware } from './auth/session';
import { configurePassport } from './auth/passport';
import { createCsrf } from './auth/csrf';
import { AccessCache, PROJECT_OF_TOPIC } from './auth/access-cache';
import { ReadCache } from './cache/read-cache';
import { authRoutes } from './auth/auth.routes';
import { userRoutes } from './users/users.routes';
import { projectRoutes } from './projects/projects.routes';
import { moleculeRoutes } from './molecules/molecules.routes';
import { healthRoutes } from './health/health.routes';
import { devMailMounted, devMailRoutes } from './mail/dev-mail.routes';
import { uploadRoutes } from './molecules/uploads.routes';
import { ConformerQueue, type Conformers } from './molecules/conformer-queue';
import { BullConformerQueue } from './molecules/bull-conformer-queue';
import { createBullJobQueue, createBullTasks } from './jobs/bull-queues';
import { mappingRoutes } from './mappings/mappings.routes';
import { mappingStarts } from './proposals/proposals.service';
import { proposalRoutes } from './proposals/proposals.routes';
import { beadTypeRoutes } from './bead-types/bead-types.routes';
import { createCollab, type Collab } from './drafts/collab-server';
import type { CollabOptions } from './drafts/room-options';
import { chemRoutes } from './chem-api/chem.routes';
import { LiveHub } from './http/live-hub';
import { createInProcessQueue } from './jobs/in-process-queue';
import type { JobQueue } from './jobs/job-queue';
import { threadRoutes } from './threads/threads.routes';
import { notificationRoutes } from './notifications/notifications.routes';
import { versionRoutes } from './versions/versions.routes';
import { lockRoutes } from './lock/lock.routes';
import { auditRoutes } from './audit/audit.routes';
import { bondedTermRoutes } from './bonded/bonded-terms.routes';
import { exportRoutes, LARGE_JSON_PATHS } from './exports/exports.routes';
import { createInProcessTasks, type BackgroundTasks } from './jobs/background-task';
import { referenceRoutes } from './references/references.routes';
import { analysisRoutes } from './analyses/analyses.routes';

export interface BuiltApp {
  app: Express;
  /** Every route the app serves, for the route × role permission test. */
  routes: RouteEntry[];
  /** The session middleware, reused to authenticate WebSocket upgrades. */
  session: express.RequestHandler;
  passport: ReturnType<typeof configurePassport>;
  /** The live-collaboration socket: attach `collab.handleUpgrade` to the HTTP server's 'upgrade'. */
  collab: Collab;
  /** Background 3D conformer jobs. */
  conformers: Conformers;
  /** Work started by a request and run after its answer (notification e-mail). */
  jobs: JobQueue;
  /** Long jobs everyone watches: reference matching and analyses (jobs/background-task.ts). */
  tasks: BackgroundTasks;
  close(): Promise<void>;
}

/**
 * GET routes whose answers the read cache keeps: each is made from MariaDB alone (plus the conformer
 * queue's positions, see above). Not the mapping detail or its threads: those follow the live drafts.
 */
const CACHED_READS = [
  '/api/me',
  '/api/projects',
  '/api/projects/:id',
  '/api/projects/:id/members',
  '/api/projects/:id/molecules',
  '/api/projects/:id/bead-types',
  '/api/molecules/:id',
  '/api/molecules/:id/mappings',
  '/api/mappings/:id/versions',
  '/api/notifications',
];

// Multipart bodies: molecule uploads and reference uploads.
const UPLOAD_PATHS = /(\/upload|^\/api\/molecules\/[^/]+\/references)$/;

export function createApp(ctx: AppContext, collabOptions: Partial<CollabOptions> = {}): BuiltApp {
  const app = express();
  // X-Forwarded-* headers are believed only when TRUST_PROXY says a proxy sits in front (config.ts).
  app.set('trust proxy', ctx.config.trustProxy);
  app.disable('x-powered-by');
  setChemJobTimeout(ctx.config.chemJobTimeoutMs);
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          'default-src': ["'self'"],
          'connect-src': ["'self'", 'ws:', 'wss:'],
          'img-src': ["'self'", 'data:', 'blob:'],
          'style-src': ["'self'", "'unsafe-inline'"],
          'font-src': ["'self'", 'data:'],
          'script-src': ["'self'", "'wasm-unsafe-eval'"],
          'upgrade-insecure-requests': null,
        },
      },
    }),
  );
  app.use(securityHeaders);
  // pino-http logs each answer at info (errors too, unless told otherwise). Above info (npm start runs at
  // warn) it would log nothing yet still build a child logger and hook every answer: then requests only
  // get a logger, made when something logs (the error middleware), with the request's method and path.
  if (ctx.log.isLevelEnabled('info')) app.use(pinoHttp({ logger: ctx.log, autoLogging: { ignore: (req) => req.url === '/api/health' } }));
  else app.use(lazyRequestLogger(ctx.log));
  const json = express.json({ limit: '1mb' });
  // Imports parse their own (larger) bodies in the route.
  app.use((req, res, next) => (LARGE_JSON_PATHS.test(req.path) ? next() : json(req, res, next)));
  app.use(requireJson((path) => UPLOAD_PATHS.test(path)));

  const { middleware: session, store, cached: sessions } = createSessionMiddleware(ctx.config);
  // Accounts, memberships and sessions kept between requests, dropped by the access changes (auth/access-cache.ts).
  const accessCache = new AccessCache(ctx.accessChanges, sessions, ctx.invalidation);
  const passport = configurePassport(ctx.db, ctx.config, accessCache);
  const csrf = createCsrf(ctx.config);
  app.use((req, _res, next) => {
    req.accessCache = accessCache;
    next();
  });
  app.use(cookieParser(), session, passport.initialize(), passport.session());
  app.use(csrf.protect);
  // Jobs a request enqueues start after its response (jobs/in-process-queue.ts), or go to BullMQ for
  // the workers when several servers share a Redis (jobs/bull-queues.ts).
  let jobs: JobQueue & { close?(): Promise<void> };
  let conformers: Conformers;
  if (ctx.config.redisUrl && ctx.redis) {
    jobs = createBullJobQueue(ctx.config.redisUrl, ctx.log);
    conformers = new BullConformerQueue(ctx.db, ctx.config.redisUrl, ctx.log, ctx.redis.commands);
  } else {
    const inProcess = createInProcessQueue(async (job) => ctx.mailer.send(job.mail), ctx.log);
    app.use(inProcess.afterResponse);
    jobs = inProcess;
    conformers = new ConformerQueue(ctx.db, ctx.log);
  }

  const collab = createCollab(ctx, [cookieParser(), session, passport.initialize(), passport.session()], collabOptions);
  // Answers of read-mostly lists and records kept per caller (cache/read-cache.ts); the molecule
  // answers show the in-process conformer queue's positions, which change without a write.
  // Access changes and deletions drop them too (see read-cache.ts for why).
  const reads = new ReadCache(ctx.db, ctx.invalidation, [(clear) => ctx.accessChanges.subscribe(clear), (clear) => ctx.invalidation.subscribe(PROJECT_OF_TOPIC, clear)]);
  conformers.on('queued', () => reads.clear());
  conformers.on('settled', (moleculeId: number) => {
    reads.clear();
    collab.refresh({ moleculeId });
  });

  const routes = new RouteTable();
  healthRoutes(routes, ctx);
  authRoutes(routes, ctx, { csrf, passport });
  userRoutes(routes, ctx);
  projectRoutes(routes, ctx);
  uploadRoutes(routes, ctx, conformers);
  moleculeRoutes(routes, ctx, conformers);
  mappingRoutes(routes, ctx, collab, mappingStarts(ctx.db, collab));
  proposalRoutes(routes, ctx, collab);
  beadTypeRoutes(routes, ctx, (projectId) => collab.refresh({ projectId }));
  chemRoutes(routes, ctx);
  // Threads and notifications share one live hub (server-sent events).
  const live = new LiveHub(ctx.redis);
  threadRoutes(routes, ctx, live, jobs, collab);
  notificationRoutes(routes, ctx, live);
  versionRoutes(routes, ctx, collab);
  lockRoutes(routes, ctx, collab.rooms);
  auditRoutes(routes, ctx);
  exportRoutes(routes, ctx, collab);
  bondedTermRoutes(routes, ctx, collab);
  // Reference matching and analyses: in process, or on BullMQ for the workers (REDIS_URL).
  const tasks: BackgroundTasks & { close?(): Promise<void> } = ctx.config.redisUrl ? createBullTasks(ctx.config.redisUrl, ctx.log) : createInProcessTasks(ctx.log);
  referenceRoutes(routes, ctx, tasks);
  analysisRoutes(routes, ctx, collab, tasks);
  if (devMailMounted(ctx)) devMailRoutes(routes, ctx);
  app.get(CACHED_READS, reads.serve);
  app.use(routes.router);
  app.use(['/api', '/dev'], unknownRoute);

  serveClient(app, ctx.config.clientDir);
  app.use(unknownRoute);
  app.use(errorMiddleware);

  return {
    app,
    routes: routes.entries,
    session,
    passport,
    collab,
    conformers,
    jobs,
    tasks,
    async close() {
      // Jobs in process run to their end; jobs on BullMQ stay queued for the workers.
      if (jobs.close) await jobs.close();
      else await jobs.idle();
      if (tasks.close) await tasks.close();
      else await tasks.idle();
      live.close();
      await conformers.close();
      await collab.close();
      accessCache.close();
      reads.close();
      await store.close();
    },
  };
}

function lazyRequestLogger(log: AppContext['log']): express.RequestHandler {
  return (req, _res, next) => {
    let child: AppContext['log'] | undefined;
    Object.defineProperty(req, 'log', { configurable: true, get: () => (child ??= log.child({ req: { method: req.method, url: req.originalUrl } })) });
    next();
  };
}

/** The built client: static files, and index.html for every other GET (client-side routes). */
function serveClient(app: Express, clientDir: string | null): void {
  if (!clientDir) return;
  const dir = resolve(clientDir);
  const index = join(dir, 'index.html');
  app.use(express.static(dir, { index: false, maxAge: '1h' }));
  app.get(/^\/(?!api\/|dev\/|collab\/).*/, (_req, res, next) => {
    if (!existsSync(index)) return next();
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index);
  });
}
