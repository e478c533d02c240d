import { createHash } from 'node:crypto';
import type { RequestHandler, Response } from 'express';
import type { Knex } from 'knex';
import type { InvalidationBus } from '../cluster/invalidation-bus';
import { TtlCache } from './ttl-cache';
import { watchWrites, type WriteWatch } from './write-watch';

/**
 * Answers of read-mostly GET endpoints, kept per caller and URL as the JSON text that was sent (with
 * its ETag, so a client that sends If-None-Match gets a 304). Under load most reads were the same few
 * lists and records asked again and again, each costing a query through knex and mysql2 and a
 * JSON.stringify; a kept answer costs none of that.
 *
 * When it is dropped: every write through this instance's knex (write-watch.ts) drops everything when
 * it begins and again when it is committed, and a read that finished while a write was open or that
 * started before a drop is not kept. Committed writes are announced on the invalidation bus
 * (READS_TOPIC), so other instances and the job workers' writes (server/worker.ts publishes too) drop
 * theirs within the bus's delay. The access changes and deletions that the per-request caches follow
 * (auth/access-cache.ts) drop everything too: on another instance they may arrive after the write's
 * announcement, and an answer made in between from the old account or role must not stay. State held
 * outside MariaDB that an answer shows (the conformer queue's positions) calls `clear()` itself. A change made straight in MariaDB by something else is
 * seen after at most `ttlMs`. Only answers of the routes `serve` is mounted on are kept, only 200s,
 * only what went through res.json, and only for a signed-in caller (the key is the account): the
 * route's own authorisation ran when the answer was made, and any access change is a write.
 *
 * Not for answers that depend on the live drafts (mapping detail, threads): those change through the
 * collaboration update log, which does not go through knex, and are kept by stored-drafts.ts instead.
 */
export const READS_TOPIC = 'reads';

export interface ReadCacheOptions {
  ttlMs: number;
  max: number;
  /** Larger answers are sent but not kept. */
  maxChars: number;
}

export const DEFAULT_READ_CACHE: ReadCacheOptions = { ttlMs: 10_000, max: 5_000, maxChars: 512 * 1024 };

interface Kept {
  body: string;
  etag: string;
}

export class ReadCache {
  private readonly entries: TtlCache<string, Kept>;
  private readonly writes: WriteWatch;
  private readonly unsubscribe: (() => void)[];
  private announce: NodeJS.Immediate | null = null;
  /** Answers sent from the cache (for tests and the benchmark's notes). */
  hits = 0;

  constructor(
    db: Knex,
    bus: InvalidationBus,
    /** Other changes that drop everything (the access changes, deletions): each subscribes `clear` and returns its unsubscribe. */
    also: ((clear: () => void) => () => void)[] = [],
    private readonly options: ReadCacheOptions = DEFAULT_READ_CACHE,
  ) {
    this.entries = new TtlCache(options.ttlMs, options.max);
    const clear = () => this.entries.clear();
    this.unsubscribe = [bus.subscribe(READS_TOPIC, clear), ...also.map((subscribe) => subscribe(clear))];
    this.writes = watchWrites(db, {
      started: () => this.entries.clear(),
      committed: () => {
        this.entries.clear();
        // Other instances: once per turn of the event loop, however many writes were committed in it.
        this.announce ??= setImmediate(() => {
          this.announce = null;
          bus.publish(READS_TOPIC, 'write');
        });
      },
    });
  }

  /** Middleware for a GET route, after authentication and before the route's handler. */
  readonly serve: RequestHandler = (req, res, next) => {
    const user = req.user;
    if (!user || (req.method !== 'GET' && req.method !== 'HEAD')) return next();
    const key = `${user.id} ${req.originalUrl}`;
    const hit = this.entries.get(key);
    if (hit) {
      this.hits++;
      return void send(res, hit);
    }
    const mark = this.entries.mark();
    const json = res.json.bind(res);
    res.json = (body: unknown) => {
      if (res.statusCode !== 200) return json(body);
      const text = JSON.stringify(body);
      const kept = { body: text, etag: etagOf(text) };
      if (text.length <= this.options.maxChars && !this.writes.open()) this.entries.setIfUnchanged(key, kept, mark);
      return send(res, kept);
    };
    next();
  };

  /** Drops every kept answer on this instance (state outside MariaDB changed). */
  clear(): void {
    this.entries.clear();
  }

  close(): void {
    if (this.announce) clearImmediate(this.announce);
    for (const off of this.unsubscribe) off();
    this.writes.stop();
    this.entries.clear();
  }
}

/** As res.json would send it; Express answers 304 itself when If-None-Match matches the ETag. */
function send(res: Response, kept: Kept): Response {
  res.setHeader('ETag', kept.etag);
  res.setHeader('Content-Type', 'application/json; charset=utf-8');
  return res.send(kept.body);
}

const etagOf = (text: string) => `"${createHash('sha1').update(text).digest('base64url')}"`;

/** A worker process's writes, announced to the app servers' read caches. */
export function announceWrites(db: Knex, bus: InvalidationBus): WriteWatch {
  let announce: NodeJS.Immediate | null = null;
  return watchWrites(db, {
    started: () => undefined,
    committed: () => {
      announce ??= setImmediate(() => {
        announce = null;
        bus.publish(READS_TOPIC, 'write');
      });
    },
  });
}
