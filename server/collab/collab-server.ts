/**
 * The live-collaboration endpoint, /collab/:mappingId, on y-protocols (sync + awareness).
 *
 * The HTTP upgrade is authenticated by running the app's own express-session and passport
 * middleware on the upgrade request, and authorised by the permission module: non-members (and
 * unknown mappings) are refused with 404, anonymous callers with 401, before any WebSocket exists.
 * Members without 'mapping:edit' — and everyone while the mapping is locked — join read-only.
 * This module also answers the REST side's questions about drafts (DraftAccess).
 */
import { ServerResponse, type IncomingMessage } from 'node:http';
import type { Duplex } from 'node:stream';
import type { RequestHandler } from 'express';
import { WebSocketServer } from 'ws';
import type { AppContext } from '../context';
import { roleInProject } from '../auth/access';
import { can, canSee } from '../auth/permissions';
import type { DraftAccess } from '../mappings/mappings.routes';
import { readStoredDraft } from '../mappings/evaluation';
import { notFound } from '../http/errors';
import { serveConnection } from './connection';
import { DEFAULT_COLLAB_OPTIONS, type CollabOptions } from './room';
import { Rooms } from './rooms';

export interface Collab extends DraftAccess {
  handleUpgrade(req: IncomingMessage, socket: Duplex, head: Buffer): void;
  rooms: Rooms;
  close(): Promise<void>;
}

const PATH = /^\/collab\/([1-9][0-9]{0,9})\/?(?:\?.*)?$/;
const MAX_FRAME = 16 * 1024 * 1024;

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
  const opts = { ...DEFAULT_COLLAB_OPTIONS, ...options };
  const rooms = new Rooms(ctx, opts);
  const wss = new WebSocketServer({ noServer: true, maxPayload: MAX_FRAME });

  const refuse = (socket: Duplex, status: number, text: string) => {
    socket.end(`HTTP/1.1 ${status} ${text}\r\nConnection: close\r\nContent-Length: 0\r\n\r\n`);
  };

  async function authorise(req: IncomingMessage, mappingId: number) {
    const res = new ServerResponse(req);
    for (const mw of middleware) await new Promise<void>((resolve, reject) => mw(req as never, res as never, (err?: unknown) => (err ? reject(err) : resolve())));
    const user = (req as unknown as { user?: Express.User }).user;
    if (!user) return { status: 401 as const };
    const row = await ctx.db('mappings as p').join('molecules as m', 'm.id', 'p.molecule_id').where('p.id', mappingId).first('m.project_id');
    if (!row) return { status: 404 as const };
    const standing = await roleInProject(ctx.db, row.project_id, user.id);
    if (!canSee(user, standing) || !can(user, 'mapping:read', standing)) return { status: 404 as const };
    return { status: 200 as const, user, role: standing.role, roleReadOnly: !can(user, 'mapping:edit', standing) };
  }

  function handleUpgrade(req: IncomingMessage, socket: Duplex, head: Buffer): void {
    const match = PATH.exec(req.url ?? '');
    if (!match) return refuse(socket, 404, 'Not Found');
    if (!sameOrigin(req)) return refuse(socket, 403, 'Forbidden');
    const mappingId = Number(match[1]);
    authorise(req, mappingId).then(
      (a) => {
        if (a.status === 401) return refuse(socket, 401, 'Unauthorized');
        if (a.status === 404) return refuse(socket, 404, 'Not Found');
        wss.handleUpgrade(req, socket, head, (ws) => {
          const session = { mappingId, userId: a.user.id, displayName: a.user.displayName, role: a.role };
          serveConnection(ws, { userId: a.user.id, displayName: a.user.displayName, session, roleReadOnly: a.roleReadOnly }, () => rooms.open(mappingId), opts.pingIntervalMs);
        });
      },
      (err) => {
        ctx.log.error({ err }, 'collab upgrade failed');
        refuse(socket, 500, 'Internal Server Error');
      },
    );
  }

  return {
    handleUpgrade,
    rooms,
    async read(mappingId) {
      const room = await rooms.live(mappingId);
      if (room) {
        // After the updates queued before this read; evaluated outside the queue so edits keep flowing.
        const { draft, result } = await room.serial(() => room.snapshot());
        return { draft, result: await result };
      }
      const stored = await readStoredDraft(ctx.db, mappingId);
      if (!stored) throw notFound('That mapping');
      return stored;
    },
    refresh(filter) {
      void rooms.all().then((all) => {
        for (const room of all) {
          const hit =
            (filter.mappingId === undefined || room.id === filter.mappingId) &&
            (filter.moleculeId === undefined || room.moleculeId === filter.moleculeId) &&
            (filter.projectId === undefined || room.projectId === filter.projectId);
          if (hit) void room.refresh().catch((err) => ctx.log.warn({ err }, 'collab refresh failed'));
        }
      });
    },
    async close() {
      await rooms.closeAll();
      for (const ws of wss.clients) ws.terminate();
      wss.close();
    },
  };
}
