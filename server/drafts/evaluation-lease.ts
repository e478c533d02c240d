import type { RedisLink } from '../cluster/redis-link';

/**
 * One server evaluates a mapping's edits at a time (REDIS_URL set): before an evaluation the room
 * asks for the mapping's lease, a Redis key holding the server's name for `ttlMs`. The holder renews
 * it with every evaluation and relays its results; the others send those results to their
 * connections instead of evaluating the same draft again. Every accepted update reaches the holder
 * through the relay, so its next result covers them all. If the holder goes away its lease lapses and
 * the next server to ask takes it (DraftEvaluator retries after `ttlMs` when no result came).
 */
export interface EvaluationLease {
  readonly ttlMs: number;
  /** True when this server holds (or just took, or renewed) the mapping's lease. */
  acquire(mappingId: number): Promise<boolean>;
  /** Gives the lease up (the room closed here). */
  release(mappingId: number): void;
}

// Take the key if free, renew it if ours; answer 1 when this server holds it afterwards.
const ACQUIRE = `
local holder = redis.call('GET', KEYS[1])
if holder == false then
  redis.call('SET', KEYS[1], ARGV[1], 'PX', ARGV[2])
  return 1
elseif holder == ARGV[1] then
  redis.call('PEXPIRE', KEYS[1], ARGV[2])
  return 1
end
return 0`;

const RELEASE = `if redis.call('GET', KEYS[1]) == ARGV[1] then return redis.call('DEL', KEYS[1]) end return 0`;

export function createRedisEvaluationLease(link: RedisLink, ttlMs = 2000): EvaluationLease {
  const key = (mappingId: number) => `beadloom:evaluation-lease:${mappingId}`;
  return {
    ttlMs,
    async acquire(mappingId) {
      // Redis away (commands wait for it to come back) or failing: evaluating here as well beats
      // leaving the numbers stale.
      const asked = link.commands.eval(ACQUIRE, 1, key(mappingId), link.instance, String(ttlMs)).then((r) => r === 1, () => true);
      let timer: NodeJS.Timeout | undefined;
      const late = new Promise<boolean>((resolve) => (timer = setTimeout(() => resolve(true), 500)));
      try {
        return await Promise.race([asked, late]);
      } finally {
        clearTimeout(timer);
      }
    },
    release(mappingId) {
      link.commands.eval(RELEASE, 1, key(mappingId), link.instance).catch(() => undefined);
    },
  };
}
