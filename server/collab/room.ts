/**
 * One mapping's live draft on this server: the Yjs document, its awareness, the connected peers.
 *
 * An update from a peer goes through, in order (one room-wide queue, so MariaDB's order is the
 * document's order):
 *   1. applied to a shadow copy and checked there (src/shared/mapping-doc-check.ts) — a refused update
 *      gets the sender an error message, the shadow is rebuilt, the real document never sees it;
 *   2. appended to mapping_updates (updates that arrived together go in one INSERT); if that fails,
 *      nothing is relayed and the senders are made to reconnect, which sends the updates again;
 *   3. relayed to the other peers and applied to the document;
 *   4. a re-evaluation is scheduled in the evaluation thread (room-evaluator.ts): `evaluationDelayMs`
 *      after the last change, at most `evaluationMaxWaitMs` after the first; its results go to every
 *      peer. A room evaluates once when it opens.
 * Compaction into a snapshot runs every `compactEvery` updates, every `compactIntervalMs` while there is
 * something to fold, and when the last peer leaves (then after the queued updates). It runs beside the
 * queue, not on it: it folds the document as it is at that moment, whose updates are exactly those up
 * to `lastUpdateId`, so updates stored meanwhile are simply left for the next compaction.
 */
import * as Y from 'yjs';
import * as encoding from 'lib0/encoding';
import { Awareness, encodeAwarenessUpdate, removeAwarenessStates } from 'y-protocols/awareness';
import { messageYjsUpdate } from 'y-protocols/sync';
import type { AppContext } from '../context';
import { applyChecked } from '../../src/shared/mapping-doc-check';
import { docToMapping, mappingToDoc } from '../../src/shared/mapping-doc';
import type { Mapping } from '../../src/shared/chem';
import { MESSAGE_AWARENESS, MESSAGE_EVALUATION, MESSAGE_RESTORE, MESSAGE_SYNC, type CollabErrorMessage, type EvaluationMessage } from '../../src/shared/collab-protocol';
import { loadEvaluationInputs, type EvaluationInputs, type EvaluationResult } from '../mappings/evaluation';
import { RoomEvaluator } from './room-evaluator';
import { touchMapping } from '../mappings/mappings.service';
import { compactDoc, loadDraft } from './draft-store';
import type { UpdateLog } from './update-log';
import type { AccessChange } from '../auth/access-changes';

export interface CollabOptions {
  pingIntervalMs: number;
  /** Evaluation starts this long after the last change… */
  evaluationDelayMs: number;
  /** …but at most this long after the first change it has not covered yet (during a burst of edits). */
  evaluationMaxWaitMs: number;
  compactEvery: number;
  compactIntervalMs: number;
  /** Largest frame (and so Yjs update) a client may send; larger ones are refused. */
  maxFrameBytes: number;
}

/** How often at most a room rewrites its mapping row's "updated" time while the bead count stays the same. */
const TOUCH_EVERY_MS = 2_000;

export const DEFAULT_MAX_FRAME_BYTES = 1024 * 1024;

export const DEFAULT_COLLAB_OPTIONS: CollabOptions = {
  pingIntervalMs: 10_000,
  evaluationDelayMs: 40,
  evaluationMaxWaitMs: 100,
  compactEvery: 500,
  compactIntervalMs: 60_000,
  maxFrameBytes: DEFAULT_MAX_FRAME_BYTES,
};

/** What a room needs of a connection. */
export interface Peer {
  readonly userId: number;
  /** The session the socket was opened with (a sign-out of it closes the socket). */
  readonly sessionId: string | null;
  /** Awareness client ids this connection has announced. */
  readonly controlled: Set<number>;
  send(frame: Uint8Array): void;
  sendError(error: CollabErrorMessage): void;
  /** Ends this connection only (malformed input). */
  fail(reason: string): void;
  /** Ends this connection so that the client reconnects and sends its changes again (they were not stored). */
  retry(reason: string): void;
  /** The mapping was locked or unlocked: tell the client whether it may edit now. */
  sessionChanged?(): void;
  /** Whether this connection may still change the draft (its role, its access, the lock). */
  mayWrite(): boolean;
  /** Access of this connection's account may have changed (collab-access.ts): decide again. */
  reconsider(change: AccessChange): void;
}

export class Room {
  readonly awareness: Awareness;
  readonly peers = new Set<Peer>();
  closed = false;
  /** Called once the last peer left and the draft was compacted (the registry then drops the room). */
  onEmptied: (() => void) | null = null;
  private shadow: Y.Doc;
  private incoming: { peer: Peer; update: Uint8Array }[] = [];
  private queue: Promise<unknown> = Promise.resolve();
  private flushQueued = false;
  private compactTimer: NodeJS.Timeout;
  private compaction: Promise<void> = Promise.resolve();
  private readonly evaluator: RoomEvaluator;
  private rowBeads = -1;
  private touchedBeads = -1;
  private touchedAt = 0;
  private touchTimer: NodeJS.Timeout | null = null;

  private constructor(
    private readonly ctx: AppContext,
    private readonly log: UpdateLog,
    private inputs: EvaluationInputs,
    readonly doc: Y.Doc,
    private lastUpdateId: number,
    private uncompacted: number,
    private readonly opts: CollabOptions,
  ) {
    this.shadow = copyOf(doc);
    this.awareness = new Awareness(doc);
    this.awareness.setLocalState(null);
    this.awareness.on('update', this.onAwareness);
    this.compactTimer = setInterval(() => void this.compact(), opts.compactIntervalMs);
    this.compactTimer.unref();
    this.evaluator = new RoomEvaluator(inputs, () => this.draft(), (r, revision) => this.publishEvaluation(r, revision), (err) => ctx.log.error({ err, mappingId: inputs.mappingId }, 'evaluation thread failed'), opts.evaluationDelayMs, opts.evaluationMaxWaitMs);
    this.evaluator.start();
  }

  /** Loads the draft from MariaDB; null when the mapping does not exist. */
  static async open(ctx: AppContext, log: UpdateLog, mappingId: number, opts: CollabOptions): Promise<Room | null> {
    const inputs = await loadEvaluationInputs(ctx.db, mappingId);
    if (!inputs) return null;
    const stored = await loadDraft(ctx.db, mappingId, inputs.model.atoms.length);
    return new Room(ctx, log, inputs, stored.doc, stored.lastUpdateId, stored.pending, opts);
  }

  get id(): number {
    return this.inputs.mappingId;
  }

  get moleculeId(): number {
    return this.inputs.moleculeId;
  }

  get projectId(): number {
    return this.inputs.projectId;
  }

  get locked(): boolean {
    return this.inputs.locked;
  }

  get atomCount(): number {
    return this.inputs.model.atoms.length;
  }

  /** Runs work on the room's queue, after everything queued before it. */
  serial<T>(work: () => Promise<T> | T): Promise<T> {
    const next = this.queue.then(work);
    this.queue = next.catch((err) => this.ctx.log.error({ err, mappingId: this.id }, 'collab room task failed'));
    return next;
  }

  join(peer: Peer): boolean {
    if (this.closed) return false;
    this.peers.add(peer);
    return true;
  }

  /** Removes a peer and its awareness; resolves true when the room emptied and was compacted. */
  leave(peer: Peer): Promise<boolean> {
    this.peers.delete(peer);
    removeAwarenessStates(this.awareness, [...peer.controlled], null);
    return this.releaseIfIdle();
  }

  receiveUpdate(peer: Peer, update: Uint8Array): void {
    this.incoming.push({ peer, update });
    if (this.flushQueued) return;
    this.flushQueued = true;
    void this.serial(() => this.flush());
  }

  /** The draft now and its evaluation (from the evaluation thread unless the last result is current). */
  snapshot(): { draft: Mapping; result: Promise<EvaluationResult> } {
    return { draft: this.draft(), result: this.evaluator.current() };
  }

  /** The newest evaluation for a peer that just joined, or null before the first (it is then on its way to everyone). */
  latestResult(): EvaluationResult | null {
    return this.evaluator.latest();
  }

  draft() {
    return docToMapping(this.doc);
  }

  evaluationFrame(r: EvaluationResult): Uint8Array {
    const msg: EvaluationMessage = { mappingId: this.id, evaluation: r.evaluation, error: r.error, evaluatedAt: r.evaluatedAt };
    const e = encoding.createEncoder();
    encoding.writeVarUint(e, MESSAGE_EVALUATION);
    encoding.writeVarString(e, JSON.stringify(msg));
    return encoding.toUint8Array(e);
  }

  /** After a lock change was published: refreshes when this room's lock state is no longer MariaDB's. */
  async recheckLock(): Promise<void> {
    const row = await this.ctx.db('mappings').where({ id: this.id }).first('locked');
    if (row && !!row.locked !== this.inputs.locked) await this.refresh();
  }

  /** Re-reads resolution, lock, coordinates and library, then re-evaluates. */
  async refresh(): Promise<void> {
    const inputs = await loadEvaluationInputs(this.ctx.db, this.id);
    if (!inputs || this.closed) return;
    const lockChanged = inputs.locked !== this.inputs.locked;
    this.inputs = inputs;
    if (lockChanged) for (const p of this.peers) p.sessionChanged?.();
    this.evaluator.changed(inputs);
  }

  /**
   * Replaces the whole draft with `mapping` as ONE server-made Yjs transaction (a restore): stored in
   * mapping_updates like any accepted update, applied, and sent to every peer at once. `around` runs on
   * the room's queue with the draft as it is just before, and must call `replace()` (or throw to
   * refuse, e.g. when the mapping got locked meanwhile) — the restore service wraps it in its MariaDB
   * transaction. The connection that announced awareness client `undoFor` gets the update as a restore
   * frame instead of a sync update, so its editor can make it one undoable step.
   */
  replaceDraft(mapping: Mapping, userId: number, around?: (current: Mapping, replace: () => Promise<void>) => Promise<void>, undoFor?: number): Promise<void> {
    return this.serial(async () => {
      const replace = async () => {
        const next = copyOf(this.doc);
        mappingToDoc(next, mapping);
        const update = Y.encodeStateAsUpdate(next, Y.encodeStateVector(this.doc));
        next.destroy();
        this.lastUpdateId = await this.log.append(this.id, [{ userId, data: update }]);
        this.uncompacted += 1;
        Y.applyUpdate(this.doc, update, 'server');
        Y.applyUpdate(this.shadow, update);
        const frame = syncUpdateFrame(update);
        for (const p of this.peers) p.send(undoFor !== undefined && p.userId === userId && p.controlled.has(undoFor) ? restoreFrame(update) : frame);
        this.scheduleEvaluation();
      };
      if (around) await around(this.draft(), replace);
      else await replace();
    });
  }

  /** A room the server opened for its own work, with nobody in it, compacts and closes as if its last peer left. */
  releaseIfIdle(): Promise<boolean> {
    if (this.peers.size > 0 || this.closed) return Promise.resolve(false);
    return this.serial(async () => {
      await this.compact();
      const empty = this.peers.size === 0;
      if (empty) this.onEmptied?.();
      return empty;
    });
  }

  /** Finishes queued work, compacts, and closes (server shutdown). */
  async shutdown(): Promise<void> {
    await this.serial(() => this.compact());
    this.close();
  }

  close(): void {
    this.closed = true;
    clearInterval(this.compactTimer);
    if (this.touchTimer) this.writeRow(); // the trailing write, now
    this.evaluator.close();
    this.awareness.destroy();
  }

  private async flush(): Promise<void> {
    this.flushQueued = false;
    // A connection that lost write access after sending (a role change, a lock) sends nothing more.
    const batch = this.incoming.splice(0).filter((item) => item.peer.mayWrite());
    const accepted: { peer: Peer; update: Uint8Array }[] = [];
    for (const item of batch) {
      let problem;
      try {
        problem = applyChecked(this.shadow, item.update, this.atomCount, { maxBytes: this.opts.maxFrameBytes });
      } catch {
        item.peer.fail('The update could not be decoded.');
        problem = undefined;
      }
      if (problem === null) {
        accepted.push(item);
        continue;
      }
      if (problem) item.peer.sendError({ code: 'update_refused', message: `Update refused: ${problem.message}`, details: problem });
      this.shadow = copyOf(this.doc, accepted.map((a) => a.update));
    }
    if (accepted.length === 0) return;
    try {
      this.lastUpdateId = await this.log.append(this.id, accepted.map((a) => ({ userId: a.peer.userId, data: a.update })));
    } catch (err) {
      // Nothing of the batch is stored or relayed. Its senders reconnect, and the sync on reconnecting
      // sends the server what it lacks.
      this.shadow = copyOf(this.doc);
      for (const peer of new Set(accepted.map((a) => a.peer))) peer.retry('The draft could not be stored just now; your changes are sent again on reconnecting.');
      throw err;
    }
    this.uncompacted += accepted.length;
    // Relay first, then apply: the frames do not depend on the document, and the shadow has already
    // shown that these updates apply. Nothing else runs between the two loops.
    for (const { peer, update } of accepted) {
      const frame = syncUpdateFrame(update);
      for (const other of this.peers) if (other !== peer) other.send(frame);
    }
    for (const { peer, update } of accepted) Y.applyUpdate(this.doc, update, peer);
    this.scheduleEvaluation();
    if (this.uncompacted >= this.opts.compactEvery) void this.compact();
  }

  /**
   * Folds the stored updates into the snapshot; compactions run one after another, never two at once.
   * Never rejects: a failure is logged and loses nothing (the updates stay in mapping_updates).
   */
  private compact(): Promise<void> {
    const next = this.compaction.then(async () => {
      if (this.uncompacted === 0) return;
      const upTo = this.lastUpdateId;
      const folded = this.uncompacted;
      await compactDoc(this.ctx.db, this.id, this.doc, upTo);
      this.uncompacted -= folded;
    });
    this.compaction = next.catch((err) => this.ctx.log.error({ err, mappingId: this.id }, 'compaction failed'));
    return this.compaction;
  }

  private scheduleEvaluation(): void {
    this.evaluator.changed();
  }

  private publishEvaluation(result: EvaluationResult, revision: number): void {
    const frame = this.evaluationFrame(result);
    for (const p of this.peers) p.send(frame);
    if (revision === 0) return; // the room's first evaluation: nothing was edited
    this.touchRow(result.evaluation?.beads.length ?? this.draft().beads.length);
  }

  /**
   * Keeps the mapping row's bead count and "updated" time current for lists: at once when the bead
   * count changed, else at most every TOUCH_EVERY_MS (a trailing write records the last edit).
   */
  private touchRow(beads: number): void {
    this.rowBeads = beads;
    const wait = beads !== this.touchedBeads ? 0 : Math.max(0, this.touchedAt + TOUCH_EVERY_MS - Date.now());
    if (this.touchTimer && wait > 0) return;
    if (this.touchTimer) clearTimeout(this.touchTimer);
    this.touchTimer = setTimeout(() => this.writeRow(), wait);
  }

  private writeRow(): void {
    if (this.touchTimer) clearTimeout(this.touchTimer);
    this.touchTimer = null;
    this.touchedBeads = this.rowBeads;
    this.touchedAt = Date.now();
    void touchMapping(this.ctx.db, this.id, this.rowBeads).catch((err) => this.ctx.log.warn({ err }, 'could not update the mapping row'));
  }

  private onAwareness = ({ added, updated, removed }: { added: number[]; updated: number[]; removed: number[] }, origin: unknown) => {
    const peer = [...this.peers].find((p) => p === origin);
    if (peer) {
      for (const id of added) peer.controlled.add(id);
      for (const id of removed) peer.controlled.delete(id);
    }
    const changed = [...added, ...updated, ...removed];
    if (changed.length === 0) return;
    const e = encoding.createEncoder();
    encoding.writeVarUint(e, MESSAGE_AWARENESS);
    encoding.writeVarUint8Array(e, encodeAwarenessUpdate(this.awareness, changed));
    const frame = encoding.toUint8Array(e);
    for (const p of this.peers) p.send(frame);
  };
}

function copyOf(doc: Y.Doc, extra: Uint8Array[] = []): Y.Doc {
  const copy = new Y.Doc();
  Y.applyUpdate(copy, Y.encodeStateAsUpdate(doc));
  for (const u of extra) Y.applyUpdate(copy, u);
  return copy;
}

export function syncUpdateFrame(update: Uint8Array): Uint8Array {
  const e = encoding.createEncoder();
  encoding.writeVarUint(e, MESSAGE_SYNC);
  encoding.writeVarUint(e, messageYjsUpdate);
  encoding.writeVarUint8Array(e, update);
  return encoding.toUint8Array(e);
}

export function restoreFrame(update: Uint8Array): Uint8Array {
  const e = encoding.createEncoder();
  encoding.writeVarUint(e, MESSAGE_RESTORE);
  encoding.writeVarUint8Array(e, update);
  return encoding.toUint8Array(e);
}
