/**
 * Cache invalidation for every instance. A cache (sessions, memberships, the newest evaluation of a
 * draft …) that keeps something this process read from MariaDB subscribes to its topic; whoever
 * changes that thing in MariaDB publishes the topic and the changed key after committing. Listeners
 * run synchronously on this instance before `publish` returns, and on the other instances when the
 * message arrives (redis-invalidation-bus.ts; a few milliseconds later).
 *
 * `key` null means "drop everything on this topic": sent to the listeners of an instance that may have
 * missed messages (its Redis subscription was interrupted). Keys and topics are short strings
 * (e.g. topic 'membership', key '12:7').
 */
/** Live drafts re-read their evaluation inputs; key: JSON of { mappingId?, moleculeId?, projectId? }. */
export const DRAFT_INPUTS_TOPIC = 'draft-inputs';

export type InvalidationListener = (key: string | null) => void;

export interface InvalidationBus {
  publish(topic: string, key: string): void;
  /** Returns the unsubscribe function. */
  subscribe(topic: string, listener: InvalidationListener): () => void;
  close(): Promise<void>;
}

/** Listeners by topic, called in subscription order; one that throws does not stop the others. */
export class TopicListeners {
  private readonly byTopic = new Map<string, Set<InvalidationListener>>();

  constructor(private readonly onError: (err: unknown) => void) {}

  add(topic: string, listener: InvalidationListener): () => void {
    let set = this.byTopic.get(topic);
    if (!set) this.byTopic.set(topic, (set = new Set()));
    set.add(listener);
    return () => void set.delete(listener);
  }

  call(topic: string, key: string | null): void {
    for (const listener of this.byTopic.get(topic) ?? []) {
      try {
        listener(key);
      } catch (err) {
        this.onError(err);
      }
    }
  }

  topics(): string[] {
    return [...this.byTopic.keys()];
  }

  clear(): void {
    this.byTopic.clear();
  }
}

/** The single-process bus (no REDIS_URL). */
export function createInProcessInvalidationBus(onError: (err: unknown) => void = () => undefined): InvalidationBus {
  const listeners = new TopicListeners(onError);
  return {
    publish: (topic, key) => listeners.call(topic, key),
    subscribe: (topic, listener) => listeners.add(topic, listener),
    async close() {
      listeners.clear();
    },
  };
}
