import type { DraftRelay, RelayedMessage } from './draft-relay';

/**
 * The relay of a single server: publish calls every subscriber of the mapping before it returns, in
 * subscription order. A listener that throws is reported and does not keep the message from the others.
 */
export function createInProcessRelay(onListenerError: (err: unknown) => void = () => {}): DraftRelay {
  const listeners = new Map<number, Set<(message: RelayedMessage) => void>>();
  return {
    publish(message) {
      for (const listener of listeners.get(message.mappingId) ?? []) {
        try {
          listener(message);
        } catch (err) {
          onListenerError(err);
        }
      }
    },
    subscribe(mappingId, listener) {
      let set = listeners.get(mappingId);
      if (!set) listeners.set(mappingId, (set = new Set()));
      set.add(listener);
      return () => {
        set.delete(listener);
        if (set.size === 0 && listeners.get(mappingId) === set) listeners.delete(mappingId);
      };
    },
    async close() {
      listeners.clear();
    },
  };
}
