/**
 * The live-collaboration endpoint, /collab/:mappingId, on y-protocols (sync + awareness).
 *
 * The HTTP upgrade is authenticated by running the app's own express-session and passport
 * middleware on the upgrade request, and authorised by the permission module (collab-access.ts):
 * non-members (and unknown mappings) are refused with 404, anonymous callers with 401, before any
 * WebSocket exists. Members without 'mapping:edit' — and everyone while the mapping is locked — join
 * read-only. Open connections follow later access changes (ctx.accessChanges). Frames larger than
 * `maxFrameBytes` are refused by the socket itself (close 1009) before they are buffered whole.
 * This module also answers the REST side's questions about drafts (DraftAccess).
 */
import { randomUUID } from 'node:crypto';
import { ServerResponse, type IncomingMessage } from 'node:http';
import type { Duplex } from 'node:stream';
import type { RequestHandler } from 'express';
import { WebSocketServer } from 'ws';
import type { AppContext } from '../context';
import type { DraftAccess } from '../mappings/draft-access';
import { loadEvaluationInputs } from './drafts.service';
import { StoredDrafts } from './stored-drafts';
import { notFound } from '../http/errors';
import { serveConnection } from './connection';
import { DEFAULT_COLLAB_OPTIONS, type CollabOptions } from './room-options';
import { createMariaDbDraftStorage } from './mariadb-draft-storage';
import { createInProcessRelay } from './in-process-relay';
import { createRedisRelay } from './redis-relay';
import { DRAFT_INPUTS_TOPIC } from '../cluster/invalidation-bus';
import { createRedisEvaluationLease } from './evaluation-lease';
import { evaluateOnceInThread, threadEvaluation } from './evaluation-thread';
import { Rooms } from './rooms';
import { decide, followAccessChanges, redecide, type OpenConnection } from './collab-access';

export interface Collab extends DraftAccess {
  handleUpgrade(req: IncomingMessage, socket: Duplex, head: Buffer): void;
  rooms: Rooms;
  /** Drafts no room holds, as REST reads them (stored-drafts.ts). */
  stored: StoredDrafts;
  close(): Promise<void>;
}

const REFRESH_TOPIC = DRAFT_INPUTS_TOPIC;
type RefreshFilter = Parameters<DraftAccess['refresh']>[0];

const PATH = /^\/collab\/([1-9][0-9]{0,9})\/?(?:\?.*)?$/;

/** Browsers send Origin; a page from another site must not open a socket with our cookie. */
function sameOrigin(req: IncomingMessage): boolean {
  const origin = req.headers.origin;
  if (!origin) return true;
  try {
    return new URL(origin).host === req.headers.host;
  } catch {
    return false;
  }
}

export function createCollab(ctx: AppContext, middleware: RequestHandler[], options: Partial<CollabOptions> = {}): Collab {
  const opts = { ...DEFAULT_COLLAB_OPTIONS, maxFrameBytes: ctx.config.collabMaxFrameBytes, ...options };
  const onRelayError = (err: unknown) => ctx.log.error({ err }, 'collab relay listener failed');
  // Several servers (REDIS_URL): updates, presence and evaluations cross through Redis; one server
  // evaluates a mapping's edits at a time.
  const redis = ctx.redis;
  const rooms = new Rooms({
    storage: createMariaDbDraftStorage(ctx.db, ctx.config.databaseUrl, !!redis),
    relay: redis ? createRedisRelay(redis, onRelayError) : createInProcessRelay(onRelayError),
    evaluation: threadEvaluation,
    loadInputs: (mappingId) => loadEvaluationInputs(ctx.db, mappingId),
    log: ctx.log,
    instance: redis?.instance ?? randomUUID(),
    options: opts,
    ...(redis ? { lease: createRedisEvaluationLease(redis) } : {}),
  });
  // Drafts no room holds, as page loads and thread lists read them: kept while MariaDB's stamp is unchanged.
  const stored = new StoredDrafts(ctx.db, evaluateOnceInThread);
  const wss = new WebSocketServer({ noServer: true, maxPayload: opts.maxFrameBytes });
  // Every open connection from its upgrade on, for access changes to reach; and a count of the
  // changes, so an upgrade decided just before one re-decides at once.
  const connections = new Set<OpenConnection>();
  let accessChanges = 0;
  const onAccessError = (err: unknown) => ctx.log.error({ err }, 'collab access change failed');
  const unfollow = followAccessChanges(ctx.accessChanges, () => connections, () => rooms.all(), onAccessError);
  const unCount = ctx.accessChanges.subscribe(() => void accessChanges++);

  const refuse = (socket: Duplex, status: number, text: string) => {
    socket.end(`HTTP/1.1 ${status} ${text}\r\nConnection: close\r\nContent-Length: 0\r\n\r\n`);
  };

  async function authorise(req: IncomingMessage, mappingId: number) {
    const res = new ServerResponse(req);
    for (const mw of middleware) await new Promise<void>((resolve, reject) => mw(req as never, res as never, (err?: unknown) => (err ? reject(err) : resolve())));
    const { user, sessionID } = req as unknown as { user?: Express.User; sessionID?: string };
    return { decision: await decide(ctx.db, user, mappingId), sessionId: sessionID ?? null };
  }

  function handleUpgrade(req: IncomingMessage, socket: Duplex, head: Buffer): void {
    const match = PATH.exec(req.url ?? '');
    if (!match) return refuse(socket, 404, 'Not Found');
    if (!sameOrigin(req)) return refuse(socket, 403, 'Forbidden');
    const mappingId = Number(match[1]);
    const changesBefore = accessChanges;
    authorise(req, mappingId).then(
      ({ decision: a, sessionId }) => {
        if (a.status === 401) return refuse(socket, 401, 'Unauthorized');
        if (a.status === 404) return refuse(socket, 404, 'Not Found');
        wss.handleUpgrade(req, socket, head, (ws) => {
          const { id: userId, displayName, sessionVersion } = a.user;
          const session = { mappingId, userId, displayName, role: a.role };
          const peer = serveConnection(
            ws,
            { userId, displayName, sessionId, session, roleReadOnly: a.roleReadOnly, redecide: (signedOut) => redecide(ctx.db, { userId, sessionVersion, signedOut }, mappingId) },
            () => rooms.open(mappingId),
            opts.pingIntervalMs,
          );
          const open = { peer, projectId: a.projectId };
          connections.add(open);
          ws.on('close', () => connections.delete(open));
          // Access changed while this upgrade was being decided: the decision may be stale.
          if (accessChanges !== changesBefore) peer.reconsider({ kind: 'account', userId });
        });
      },
      (err) => {
        ctx.log.error({ err }, 'collab upgrade failed');
        refuse(socket, 500, 'Internal Server Error');
      },
    );
  }

  const refreshHere = (filter: RefreshFilter) => {
    void rooms.all().then((all) => {
      for (const room of all) {
        const hit =
          (filter.mappingId === undefined || room.id === filter.mappingId) &&
          (filter.moleculeId === undefined || room.moleculeId === filter.moleculeId) &&
          (filter.projectId === undefined || room.projectId === filter.projectId);
        if (hit) void room.refresh().catch((err) => ctx.log.warn({ err }, 'collab refresh failed'));
      }
    });
  };
  // A null key: this server may have missed refreshes (Redis reconnected): every room re-reads.
  const unRefresh = ctx.invalidation.subscribe(REFRESH_TOPIC, (key) => refreshHere(key === null ? {} : (JSON.parse(key) as RefreshFilter)));

  return {
    handleUpgrade,
    rooms,
    stored,
    async read(mappingId) {
      const room = await rooms.live(mappingId);
      if (room) {
        // After the updates queued before this read; evaluated outside the queue so edits keep flowing.
        const { draft, result } = await room.serial(() => room.snapshot());
        return { draft, result: await result };
      }
      const kept = await stored.read(mappingId);
      if (!kept) throw notFound('That mapping');
      return kept;
    },
    storedDerived: (mappingId, name, make) => stored.derived(mappingId, name, make),
    refresh(filter) {
      // Every server's rooms of the mapping re-read their inputs (the bus calls this server's at once).
      ctx.invalidation.publish(REFRESH_TOPIC, JSON.stringify(filter));
    },
    async close() {
      unfollow();
      unCount();
      unRefresh();
      await rooms.closeAll();
      for (const ws of wss.clients) ws.terminate();
      wss.close();
    },
  };
}
