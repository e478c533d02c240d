import type { Logger } from 'pino';
import type { Config } from './config';
import type { Db } from './db/knex';
import type { Mailer } from './mail/mailer';
import type { AccessChanges } from './auth/access-changes';
import type { InvalidationBus } from './cluster/invalidation-bus';
import type { RedisLink } from './cluster/redis-link';

/** What every route module and service is given; built once in server/app.ts. */
export interface AppContext {
  config: Config;
  db: Db;
  mailer: Mailer;
  log: Logger;
  /** True while mail goes to the local sink; /dev/mail can exist only then (see mail/dev-mail.routes.ts). */
  mailSinkInUse: boolean;
  /** Role, membership, account, lock and sign-out changes, for open sockets to follow. */
  accessChanges: AccessChanges;
  /** Cache invalidations that reach every instance (in-process without REDIS_URL). */
  invalidation: InvalidationBus;
  /** The shared Redis (REDIS_URL), null for a single process: relays, leases, rate limits and queues use it. */
  redis: RedisLink | null;
}
