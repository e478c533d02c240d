import { Redis } from 'ioredis';
import type { Logger } from 'pino';

/**
 * This instance's two connections to the shared Redis (REDIS_URL): `commands` for everything that is
 * not pub/sub (publishing, leases, rate-limit counters, BullMQ makes its own) and `subscriber`, which
 * Redis puts in subscriber mode. Channels are multiplexed here, so every part of the app that crosses
 * instances (drafts, presence, live events, access changes, cache invalidations) shares them.
 *
 * Pub/sub delivers at most once: a message published while this instance's subscriber was
 * disconnected is lost. ioredis reconnects and re-subscribes by itself; once the subscriptions are
 * active again (a PING on the subscriber connection answers after they are), `onResync` listeners run,
 * and each catches up from where the truth is kept (MariaDB) or drops what it cached. The
 * `commands` connection queues commands while Redis is away (maxRetriesPerRequest: null), so what was
 * published during an outage is sent, in order, when Redis is back.
 */
export type ChannelListener = (message: Buffer) => void;

export class RedisLink {
  readonly commands: Redis;
  readonly subscriber: Redis;
  private readonly listeners = new Map<string, Set<ChannelListener>>();
  private readonly resyncListeners = new Set<() => void>();
  private readonly subscribing = new Map<string, Promise<unknown>>();
  private readyOnce = false;
  /** Resyncs so far (tests wait on it). */
  resyncs = 0;

  constructor(
    readonly url: string,
    /** This process's name on the channels (messages it published come back to it; listeners may skip them). */
    readonly instance: string,
    private readonly log: Pick<Logger, 'warn' | 'error' | 'info'>,
  ) {
    const options = { maxRetriesPerRequest: null, retryStrategy: (times: number) => Math.min(50 * times, 1000), lazyConnect: false };
    this.commands = new Redis(url, { ...options, connectionName: `beadloom-${instance}` });
    this.subscriber = new Redis(url, { ...options, connectionName: `beadloom-sub-${instance}` });
    this.commands.on('error', (err) => this.log.warn({ err: err.message }, 'redis (commands) connection error'));
    this.subscriber.on('error', (err) => this.log.warn({ err: err.message }, 'redis (subscriber) connection error'));
    this.subscriber.on('messageBuffer', (channel: Buffer, message: Buffer) => {
      const set = this.listeners.get(channel.toString());
      if (!set) return;
      for (const listener of set) {
        try {
          listener(message);
        } catch (err) {
          this.log.error({ err }, 'redis channel listener failed');
        }
      }
    });
    this.subscriber.on('ready', () => {
      if (!this.readyOnce) {
        this.readyOnce = true;
        return;
      }
      // ioredis re-sent SUBSCRIBE for every channel before 'ready'; the PING answers after them.
      void this.subscriber.ping().then(
        () => this.resync(),
        (err) => this.log.warn({ err }, 'redis resubscription check failed'),
      );
    });
  }

  /** Resolves once both connections answer (start-up fails early on a wrong REDIS_URL). */
  async ready(): Promise<void> {
    await Promise.all([this.commands.ping(), this.subscriber.ping()]);
  }

  publish(channel: string, message: Buffer | string): void {
    this.commands.publish(channel, message).catch((err: unknown) => this.log.warn({ err, channel }, 'redis publish failed'));
  }

  /**
   * Listens on `channel`; `subscribed` resolves once Redis confirmed the subscription (messages
   * published from then on arrive). Returns the unsubscribe function.
   */
  subscribe(channel: string, listener: ChannelListener): { unsubscribe: () => void; subscribed: Promise<void> } {
    let set = this.listeners.get(channel);
    if (!set) {
      this.listeners.set(channel, (set = new Set()));
      const pending = this.subscriber.subscribe(channel).finally(() => this.subscribing.delete(channel));
      this.subscribing.set(channel, pending);
    }
    set.add(listener);
    const subscribed = Promise.resolve(this.subscribing.get(channel)).then(() => undefined);
    return {
      subscribed,
      unsubscribe: () => {
        const current = this.listeners.get(channel);
        if (!current?.delete(listener) || current.size > 0) return;
        this.listeners.delete(channel);
        this.subscriber.unsubscribe(channel).catch(() => undefined);
      },
    };
  }

  /** `listener` runs after every reconnection of the subscriber, once its subscriptions are active again. */
  onResync(listener: () => void): () => void {
    this.resyncListeners.add(listener);
    return () => void this.resyncListeners.delete(listener);
  }

  async close(): Promise<void> {
    this.listeners.clear();
    this.resyncListeners.clear();
    await Promise.all([this.commands.quit().catch(() => this.commands.disconnect()), this.subscriber.quit().catch(() => this.subscriber.disconnect())]);
  }

  private resync(): void {
    this.resyncs++;
    this.log.info({ channels: this.listeners.size }, 'redis subscriber reconnected: catching up');
    for (const listener of this.resyncListeners) {
      try {
        listener();
      } catch (err) {
        this.log.error({ err }, 'redis resync listener failed');
      }
    }
  }
}
