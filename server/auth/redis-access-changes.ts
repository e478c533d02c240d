import type { RedisLink } from '../cluster/redis-link';
import { createLocalAccessChanges, type AccessChange, type AccessChanges } from './access-changes';

/**
 * Access changes for every instance (REDIS_URL set): a change runs this instance's listeners at once
 * (as the local hub does) and goes out on one Redis channel as JSON; the other instances run theirs
 * when it arrives. After a Redis reconnection nothing is replayed: a change published meanwhile is
 * lost for this instance's sockets until their next upgrade, so every open connection is re-decided
 * (a `resync` change, which the collab server treats like an account change of everyone).
 */
const CHANNEL = 'beadloom:access';

export function createRedisAccessChanges(link: RedisLink, onListenerError: (err: unknown) => void): AccessChanges & { close(): void } {
  const local = createLocalAccessChanges(onListenerError);
  const { unsubscribe } = link.subscribe(CHANNEL, (raw) => {
    const { instance, change } = JSON.parse(raw.toString()) as { instance: string; change: AccessChange };
    if (instance !== link.instance) local.publish(change);
  });
  const stopResync = link.onResync(() => local.publish({ kind: 'resync' }));
  return {
    publish(change) {
      local.publish(change);
      link.publish(CHANNEL, JSON.stringify({ instance: link.instance, change }));
    },
    subscribe: (listener) => local.subscribe(listener),
    close() {
      unsubscribe();
      stopResync();
    },
  };
}
