import { randomUUID } from 'node:crypto';
import type { Logger } from 'pino';
import { RedisLink } from './redis-link';
import { createInProcessInvalidationBus, type InvalidationBus } from './invalidation-bus';
import { createRedisInvalidationBus } from './redis-invalidation-bus';

/**
 * What ties this process to the other instances: nothing (no REDIS_URL: the in-process
 * implementations, exactly as one server always worked) or one RedisLink that the relays, hubs and
 * the invalidation bus share. Built once by server/index.ts (and by tests that run several instances).
 */
export interface ClusterLinks {
  /** This process's name on the channels. */
  instance: string;
  redis: RedisLink | null;
  invalidation: InvalidationBus;
  close(): Promise<void>;
}

export async function connectCluster(redisUrl: string | null, log: Pick<Logger, 'warn' | 'error' | 'info'>): Promise<ClusterLinks> {
  const instance = randomUUID();
  const onError = (err: unknown) => log.error({ err }, 'invalidation listener failed');
  if (!redisUrl) {
    const invalidation = createInProcessInvalidationBus(onError);
    return { instance, redis: null, invalidation, close: () => invalidation.close() };
  }
  const redis = new RedisLink(redisUrl, instance, log);
  await redis.ready();
  const invalidation = createRedisInvalidationBus(redis, onError);
  return {
    instance,
    redis,
    invalidation,
    async close() {
      await invalidation.close();
      await redis.close();
    },
  };
}
