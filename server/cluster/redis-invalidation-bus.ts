import type { RedisLink } from './redis-link';
import { TopicListeners, type InvalidationBus } from './invalidation-bus';

/**
 * The invalidation bus over Redis pub/sub: one channel for all topics. A publication runs this
 * instance's listeners at once and goes to Redis as `instance \n topic \n key`; the other instances
 * run theirs when it arrives (this instance skips its own). After a Redis reconnection every topic's
 * listeners get `null` (drop everything): invalidations sent meanwhile are lost.
 */
const CHANNEL = 'beadloom:invalidate';

export function createRedisInvalidationBus(link: RedisLink, onError: (err: unknown) => void): InvalidationBus {
  const listeners = new TopicListeners(onError);
  const { unsubscribe } = link.subscribe(CHANNEL, (raw) => {
    const [instance, topic, key] = raw.toString().split('\n');
    if (instance === link.instance || topic === undefined || key === undefined) return;
    listeners.call(topic, key);
  });
  const stopResync = link.onResync(() => {
    for (const topic of listeners.topics()) listeners.call(topic, null);
  });
  return {
    publish(topic, key) {
      listeners.call(topic, key);
      link.publish(CHANNEL, `${link.instance}\n${topic}\n${key}`);
    },
    subscribe: (topic, listener) => listeners.add(topic, listener),
    async close() {
      unsubscribe();
      stopResync();
      listeners.clear();
    },
  };
}
