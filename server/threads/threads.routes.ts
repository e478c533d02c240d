import { z } from 'zod';
import type { RequestHandler } from 'express';
import type { AppContext } from '../context';
import type { RouteTable } from '../http/route-table';
import { typed } from '../http/validate';
import { requireUser } from '../auth/access';
import { AppError, forbidden, tooLarge, unprocessable } from '../http/errors';
import { authorizeMapping } from '../mappings/mapping-access';
import { getVersion } from '../versions/versions.service';
import { idParam } from '../../src/shared/fields';
import { COMMENT_MAX, createCommentBody, createThreadBody, listThreadsQuery, updateCommentBody, updateThreadBody, type ThreadEvent } from '../../src/shared/threads';
import { normaliseMentions } from '../../src/shared/threads-mentions';
import { notifyComment, type NewComment } from '../notifications/notify';
import { draftBeads } from './draft-beads';
import type { DraftAccess } from '../mappings/draft-access';
import { mappingChannel, wantsEventStream, type LiveHub } from '../http/live-hub';
import type { JobQueue } from '../jobs/job-queue';
import { authorizeComment, authorizeThread } from './thread-access';
import * as threads from './threads.service';

const params = z.object({ id: idParam });

/** Over-long bodies answer 413 (not a 400 validation error), before anything else looks at them. */
const bodyLimit: RequestHandler = (req, _res, next) => {
  const body = (req.body as { body?: unknown } | undefined)?.body;
  if (typeof body === 'string' && body.length > COMMENT_MAX) throw tooLarge(`A comment has at most ${COMMENT_MAX} characters; this one has ${body.length}.`, { max: COMMENT_MAX, length: body.length });
  next();
};

export function threadRoutes(r: RouteTable, ctx: AppContext, live: LiveHub, jobs: JobQueue, drafts: DraftAccess): void {
  const db = ctx.db;

  /** Mentions rewritten against the project's members (threads-mentions.ts); still within the limit. */
  const prepare = async (projectId: number, body: string) => {
    const text = normaliseMentions(body, await threads.projectMembers(db, projectId));
    if (text.length > COMMENT_MAX) throw tooLarge(`A comment has at most ${COMMENT_MAX} characters.`, { max: COMMENT_MAX, length: text.length });
    return text;
  };

  /** Notifies the people a stored comment concerns (notifications/notify.ts); the thread's side says who could. */
  const notify = async (c: NewComment) =>
    notifyComment(ctx, { live, jobs }, c, {
      members: new Set((await threads.projectMembers(db, c.projectId)).keys()),
      participants: c.previousBody === undefined ? await threads.participants(db, c.threadId) : [],
    });

  /** Tells everyone viewing the mapping; returns the thread as it is now. */
  const publish = async (threadId: number, mappingId: number) => {
    const thread = await threads.getThread(db, threadId, await draftBeads(drafts, mappingId));
    const event: ThreadEvent = { type: 'thread', thread };
    live.publish(mappingChannel(mappingId), event.type, event);
    return thread;
  };

  r.get('/api/mappings/:id/threads', typed({ params, query: listThreadsQuery }, async ({ params, query }, req, res) => {
    const id = params.id;
    await authorizeMapping(db, req, id, 'thread:read');
    // The draft's bead names (a stamp query) and the thread list's one query run side by side.
    const list = await threads.listThreads(db, id, draftBeads(drafts, id), query.status);
    if (query.version === undefined) return void res.json(list);
    // Viewing a version: the threads of the beads it contains.
    const inVersion = new Set((await getVersion(db, id, query.version)).draft.beads.map((b) => b.id));
    res.json(list.filter((t) => inVersion.has(t.beadId)));
  }));

  r.post('/api/mappings/:id/threads', bodyLimit, typed({ params, body: createThreadBody }, async ({ params, body: { beadId, body } }, req, res) => {
    const mappingId = params.id;
    const user = requireUser(req);
    const { projectId } = await authorizeMapping(db, req, mappingId, 'comment:create');
    const beads = await draftBeads(drafts, mappingId);
    if (!beads.ever.has(beadId) && !(await threads.beadInVersions(db, mappingId, beadId)) && !(await threads.beadRecorded(db, mappingId, beadId))) {
      throw unprocessable('unknown_bead', 'This mapping has never had a bead with that id.', { beadId });
    }
    const text = await prepare(projectId, body);
    const { threadId, commentId } = await threads.createThread(db, { mappingId, beadId, beadName: beads.current.get(beadId) ?? null, userId: user.id, body: text });
    const thread = await publish(threadId, mappingId);
    await notify({ projectId, mappingId, threadId, commentId, beadId, beadName: thread.beadName, author: user, body: text });
    res.status(201).json(thread);
  }));

  r.post('/api/threads/:id/comments', bodyLimit, typed({ params, body: createCommentBody }, async ({ params, body }, req, res) => {
    const user = requireUser(req);
    const place = await authorizeThread(db, req, params.id, 'comment:create');
    const text = await prepare(place.projectId, (body as { body: string }).body);
    const commentId = await threads.addComment(db, place.threadId, user.id, text);
    const thread = await publish(place.threadId, place.mappingId);
    await notify({ ...place, commentId, beadName: thread.beadName, author: user, body: text });
    res.status(201).json(thread.comments.find((c) => c.id === commentId));
  }));

  r.patch('/api/threads/:id', typed({ params, body: updateThreadBody }, async ({ params, body }, req, res) => {
    const place = await authorizeThread(db, req, params.id, 'comment:create');
    await threads.setResolved(db, place.threadId, requireUser(req).id, (body as { resolved: boolean }).resolved);
    res.json(await publish(place.threadId, place.mappingId));
  }));

  r.patch('/api/comments/:id', bodyLimit, typed({ params, body: updateCommentBody }, async ({ params, body }, req, res) => {
    const id = params.id;
    const place = await authorizeComment(db, req, id, 'comment:create');
    if (place.authorId !== requireUser(req).id) throw forbidden('Only its author may edit a comment.');
    if (place.deleted) throw new AppError(409, 'comment_deleted', 'That comment has been deleted.');
    const previousBody = await threads.commentBody(db, id);
    const text = await prepare(place.projectId, (body as { body: string }).body);
    await threads.editComment(db, id, text);
    const thread = await publish(place.threadId, place.mappingId);
    await notify({ ...place, commentId: id, beadName: thread.beadName, author: requireUser(req), body: text, previousBody });
    res.json(thread.comments.find((c) => c.id === id));
  }));

  r.delete('/api/comments/:id', typed({ params }, async ({ params }, req, res) => {
    const id = params.id;
    const user = requireUser(req);
    // Authors delete their own comments; supervisors (comment:moderate) delete anyone's.
    const own = await authorizeComment(db, req, id, 'comment:create');
    if (own.authorId !== user.id) await authorizeComment(db, req, id, 'comment:moderate');
    if (!own.deleted) {
      await threads.deleteComment(db, id, user.id);
      await publish(own.threadId, own.mappingId);
    }
    res.status(204).end();
  }));

  r.get('/api/mappings/:id/events', typed({ params }, async ({ params }, req, res) => {
    const id = params.id;
    await authorizeMapping(db, req, id, 'thread:read');
    if (!wantsEventStream(req)) throw new AppError(406, 'not_acceptable', 'This is a server-sent event stream: ask for text/event-stream.');
    live.stream(req, res, mappingChannel(id));
  }));
}
