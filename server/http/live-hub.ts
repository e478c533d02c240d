import { EventEmitter } from 'node:events';
import type { Request, Response } from 'express';

/**
 * Live delivery of thread changes and notifications, as server-sent events (SSE).
 *
 * Two kinds of stream: one per mapping (GET /api/mappings/:id/events — thread and comment changes,
 * for everyone viewing that mapping) and one per person (GET /api/notifications/events — their
 * unread count). Wire format: `event: <type>\ndata: <one line of JSON>\n\n`; a `: ping` comment every
 * 25 s keeps proxies from closing an idle stream. Browsers' EventSource reconnects by itself; on every
 * (re)connection the client refetches, so an event missed while away costs nothing.
 *
 * This hub lives in one process. With several app servers behind a load balancer, publish() goes
 * through Redis pub/sub instead (see docs/architecture.md).
 */
export class LiveHub {
  private readonly emitter = new EventEmitter().setMaxListeners(0);

  publish(channel: string, type: string, data: unknown): void {
    this.emitter.emit(channel, type, data);
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
    this.emitter.on(channel, send);
    req.on('close', () => {
      clearInterval(ping);
      this.emitter.off(channel, send);
    });
  }
}

export const mappingChannel = (mappingId: number) => `mapping:${mappingId}`;
export const userChannel = (userId: number) => `user:${userId}`;

/** Event streams answer only clients that ask for one (EventSource sends this Accept header). */
export function wantsEventStream(req: Request): boolean {
  return /text\/event-stream/i.test(req.get('accept') ?? '');
}
