import { EventEmitter } from 'node:events';
import type { Request, Response } from 'express';
import type { RedisLink } from '../cluster/redis-link';

/**
 * Live delivery of thread changes and notifications, as server-sent events (SSE).
 *
 * Two kinds of stream: one per mapping (GET /api/mappings/:id/events — thread and comment changes,
 * for everyone viewing that mapping) and one per person (GET /api/notifications/events — their
 * unread count). Wire format: `event: <type>\ndata: <one line of JSON>\n\n`; a `: ping` comment every
 * 25 s keeps proxies from closing an idle stream. Browsers' EventSource reconnects by itself; on every
 * (re)connection the client refetches, so an event missed while away costs nothing.
 *
 * Without Redis the hub lives in one process. With several app servers (a RedisLink), publish()
 * also goes out on one Redis channel, and each server hands what the others published to its own
 * streams. An event lost while Redis was away costs what any missed event costs: EventSource
 * reconnects and the client refetches (docs/scaling.md).
 */
const LIVE_CHANNEL = 'beadloom:live';
const RESYNC = Symbol('resync');

export class LiveHub {
  private readonly emitter = new EventEmitter().setMaxListeners(0);
  private readonly stopRedis: () => void = () => undefined;

  constructor(private readonly redis: RedisLink | null = null) {
    if (!redis) return;
    const { unsubscribe } = redis.subscribe(LIVE_CHANNEL, (raw) => {
      const { instance, channel, type, data } = JSON.parse(raw.toString()) as { instance: string; channel: string; type: string; data: unknown };
      if (instance !== redis.instance) this.emitter.emit(channel, type, data);
    });
    // Events may have been lost while Redis was away: end every stream; EventSource reconnects and refetches.
    const stopResync = redis.onResync(() => this.emitter.emit(RESYNC));
    this.stopRedis = () => {
      unsubscribe();
      stopResync();
    };
  }

  publish(channel: string, type: string, data: unknown): void {
    this.emitter.emit(channel, type, data);
    this.redis?.publish(LIVE_CHANNEL, JSON.stringify({ instance: this.redis.instance, channel, type, data }));
  }

  close(): void {
    this.stopRedis();
  }

  /** Serves one SSE stream on `channel` until the client goes away. */
  stream(req: Request, res: Response, channel: string, pingMs = 25_000): void {
    res.status(200).set({
      'Content-Type': 'text/event-stream; charset=utf-8',
      'Cache-Control': 'no-cache, no-transform',
      Connection: 'keep-alive',
      'X-Accel-Buffering': 'no',
    });
    res.flushHeaders();
    res.write('retry: 2000\n: connected\n\n');
    const send = (type: string, data: unknown) => res.write(`event: ${type}\ndata: ${JSON.stringify(data)}\n\n`);
    const ping = setInterval(() => res.write(': ping\n\n'), pingMs);
    const end = () => res.end();
    this.emitter.on(channel, send);
    this.emitter.on(RESYNC, end);
    req.on('close', () => {
      clearInterval(ping);
      this.emitter.off(channel, send);
      this.emitter.off(RESYNC, end);
    });
  }
}

export const mappingChannel = (mappingId: number) => `mapping:${mappingId}`;
export const userChannel = (userId: number) => `user:${userId}`;

/** Event streams answer only clients that ask for one (EventSource sends this Accept header). */
export function wantsEventStream(req: Request): boolean {
  return /text\/event-stream/i.test(req.get('accept') ?? '');
}
