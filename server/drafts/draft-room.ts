/**
 * One mapping's live draft on this server: the Yjs document, its awareness, the connected peers.
 *
 * An update from a peer goes through, in order (one room-wide queue, so storage's order is the
 * document's order):
 *   1. check: applied to the shadow copy and checked there (checked-shadow.ts) — a refused update gets
 *      the sender an error message and is neither stored nor relayed; of an accepted one, what it
 *      added (as the shadow encodes it) goes on;
 *   2. store: appended to storage (updates that arrived together go in one append); if that fails,
 *      nothing is relayed and the senders are made to reconnect, which sends the updates again;
 *   3. relay: published with its sequence number (draft-relay.ts); every room of the mapping sends it
 *      to its peers but the sender, and this room applies it to the document;
 *   4. evaluate: a re-evaluation is scheduled (draft-evaluator.ts); its results go to every peer.
 *      A room evaluates once when it opens.
 * Compaction (compactor.ts) runs every `compactEvery` updates, every `compactIntervalMs` while there is
 * something to fold, and when the last peer leaves (then after the queued updates).
 * Storage, relay and evaluation are passed in (RoomDeps), so this order is unit-tested without a
 * database (tests/unit/drafts/).
 */
import * as Y from 'yjs';
import type { Awareness } from 'y-protocols/awareness';
import type { Logger } from 'pino';
import { docToMapping, mappingToDoc } from '../../src/shared/mapping-doc';
import type { Mapping } from '../../src/shared/chem';
import type { EvaluationInputs, EvaluationResult } from './evaluate-draft';
import { DraftEvaluator, type EvaluationService } from './draft-evaluator';
import type { DraftStorage } from './draft-storage';
import type { DraftRelay, RelayedMessage, RelayedUpdate } from './draft-relay';
import { CheckedShadow, copyOf } from './checked-shadow';
import { Compactor } from './compactor';
import { RowTouch } from './row-touch';
import { evaluationFrame, restoreFrame, syncUpdateFrame } from './frames';
import { RoomPresence } from './room-presence';
import type { CollabOptions } from './room-options';
import type { Peer } from './peer';
import type { EvaluationLease } from './evaluation-lease';
import { SeenSequence } from './seen-sequence';

export interface RoomDeps {
  storage: DraftStorage;
  relay: DraftRelay;
  evaluation: EvaluationService;
  /** The mapping's evaluation inputs (molecule, coordinates, library, resolution, lock) as stored now. */
  loadInputs(mappingId: number): Promise<EvaluationInputs | null>;
  log: Pick<Logger, 'error' | 'warn'>;
  /** This server's name on the relay. */
  instance: string;
  options: CollabOptions;
  /** Several servers: the lease that lets one of them evaluate a mapping's edits (evaluation-lease.ts). */
  lease?: EvaluationLease;
}

/** The origin of updates that came through the relay from another server. */
const RELAYED = Symbol('relayed');

export class DraftRoom {
  readonly peers = new Set<Peer>();
  closed = false;
  /** Called once the last peer left and the draft was compacted (the registry then drops the room). */
  onEmptied: (() => void) | null = null;
  /** Relayed updates whose predecessor this room never had (a lost message: its draft was behind). */
  gaps = 0;
  /** Catch-ups from storage that found something missing (a gap, or updates stored before the relay's subscription). */
  caughtUp = 0;
  private readonly shadow: CheckedShadow;
  private readonly presence: RoomPresence;
  private incoming: { peer: Peer; update: Uint8Array }[] = [];
  private queue: Promise<unknown> = Promise.resolve();
  private flushQueued = false;
  private readonly compactTimer: NodeJS.Timeout;
  private readonly compactor: Compactor;
  private readonly evaluator: DraftEvaluator;
  private readonly rowTouch: RowTouch;
  private readonly unsubscribe: () => void;
  /** The stored updates this room has. */
  private readonly seen: SeenSequence;
  private catchUpQueued = false;

  private constructor(
    private readonly deps: RoomDeps,
    private inputs: EvaluationInputs,
    readonly doc: Y.Doc,
    lastUpdateId: number,
    uncompacted: number,
  ) {
    const { options, log, storage } = deps;
    const mappingId = inputs.mappingId;
    this.shadow = new CheckedShadow(doc, options.maxFrameBytes);
    this.seen = new SeenSequence(lastUpdateId);
    this.compactor = new Compactor(mappingId, doc, storage, lastUpdateId, uncompacted, (err) => log.error({ err, mappingId }, 'compaction failed'));
    this.rowTouch = new RowTouch((beads) => storage.touch(mappingId, beads), (err) => log.warn({ err, mappingId }, 'could not update the mapping row'));
    this.presence = new RoomPresence(doc, this.peers, (update) => deps.relay.publish({ kind: 'awareness', mappingId, update, instance: deps.instance }));
    this.unsubscribe = deps.relay.subscribe(mappingId, this.onRelayed);
    this.compactTimer = setInterval(() => void this.compactor.compact(), options.compactIntervalMs);
    this.compactTimer.unref();
    const onFailure = (err: unknown) => log.error({ err, mappingId }, 'evaluation thread failed');
    const lease = deps.lease;
    const evaluationLease = lease && { ttlMs: lease.ttlMs, acquire: () => lease.acquire(mappingId) };
    this.evaluator = new DraftEvaluator(inputs, () => this.draft(), (r, revision) => this.publishEvaluation(r, revision), onFailure, deps.evaluation, options.evaluationDelayMs, options.evaluationMaxWaitMs, evaluationLease);
    this.evaluator.start();
  }

  /** Loads the draft from storage; null when the mapping does not exist. */
  static async open(deps: RoomDeps, mappingId: number): Promise<DraftRoom | null> {
    const inputs = await deps.loadInputs(mappingId);
    if (!inputs) return null;
    const stored = await deps.storage.load(mappingId, inputs.model.atoms.length);
    return new DraftRoom(deps, inputs, stored.doc, stored.lastUpdateId, stored.pending);
  }

  get awareness(): Awareness {
    return this.presence.awareness;
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
    this.queue = next.catch((err) => this.deps.log.error({ err, mappingId: this.id }, 'collab room task failed'));
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
    this.presence.forget(peer);
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

  draft(): Mapping {
    return docToMapping(this.doc);
  }

  evaluationFrame(r: EvaluationResult): Uint8Array {
    return evaluationFrame({ mappingId: this.id, evaluation: r.evaluation, error: r.error, evaluatedAt: r.evaluatedAt });
  }

  /** After a lock change was published: takes the stored inputs when the lock is no longer what this room has. */
  async recheckLock(): Promise<void> {
    const inputs = await this.deps.loadInputs(this.id);
    if (inputs && inputs.locked !== this.inputs.locked) this.adopt(inputs);
  }

  /** Re-reads resolution, lock, coordinates and library, then re-evaluates. */
  async refresh(): Promise<void> {
    const inputs = await this.deps.loadInputs(this.id);
    if (inputs) this.adopt(inputs);
  }

  /**
   * Replaces the whole draft with `mapping` as ONE server-made Yjs transaction (a restore): stored
   * like any accepted update, relayed and applied, so every peer gets it at once. `around` runs on the
   * room's queue with the draft as it is just before, and must call `replace()` (or throw to refuse,
   * e.g. when the mapping got locked meanwhile) — the restore service wraps it in its MariaDB
   * transaction. The connection that announced awareness client `undoFor` gets the update as a restore
   * frame instead of a sync update, so its editor can make it one undoable step.
   */
  replaceDraft(mapping: Mapping, userId: number, around?: (current: Mapping, replace: () => Promise<void>) => Promise<void>, undoFor?: number): Promise<void> {
    return this.editDraft((next) => mappingToDoc(next, mapping), userId, around, undoFor);
  }

  /**
   * A server-side edit of the draft (a restore, bonded terms set through the API): `edit` runs on a
   * copy, and the difference is stored, relayed and applied like any accepted update, on the room's
   * queue. `around` runs inside the queue with the draft as it is then and decides whether to apply.
   */
  editDraft(edit: (next: Y.Doc, current: Mapping) => void, userId: number, around?: (current: Mapping, replace: () => Promise<void>) => Promise<void>, undoFor?: number): Promise<void> {
    return this.serial(async () => {
      const replace = async () => {
        const next = copyOf(this.doc);
        edit(next, this.draft());
        const update = Y.encodeStateAsUpdate(next, Y.encodeStateVector(this.doc));
        next.destroy();
        const prevSeq = this.compactor.lastUpdateId;
        const seq = await this.deps.storage.append(this.id, [{ userId, data: update }]);
        this.compactor.stored(seq, 1);
        this.shadow.apply(update);
        const restoreFor = undoFor === undefined ? undefined : { userId, clientId: undoFor };
        this.deps.relay.publish({ kind: 'update', mappingId: this.id, seq, prevSeq, update, instance: this.deps.instance, sender: null, restoreFor });
        Y.applyUpdate(this.doc, update, 'server');
        this.evaluator.changed();
      };
      if (around) await around(this.draft(), replace);
      else await replace();
    });
  }

  /** A room the server opened for its own work, with nobody in it, compacts and closes as if its last peer left. */
  releaseIfIdle(): Promise<boolean> {
    if (this.peers.size > 0 || this.closed) return Promise.resolve(false);
    return this.serial(async () => {
      await this.compactor.compact();
      const empty = this.peers.size === 0;
      if (empty) this.onEmptied?.();
      return empty;
    });
  }

  /** Finishes queued work, compacts, and closes (server shutdown). */
  async shutdown(): Promise<void> {
    await this.serial(() => this.compactor.compact());
    this.close();
  }

  close(): void {
    this.closed = true;
    clearInterval(this.compactTimer);
    this.unsubscribe();
    this.deps.lease?.release(this.id);
    this.rowTouch.close();
    this.evaluator.close();
    this.presence.destroy();
  }

  private adopt(inputs: EvaluationInputs): void {
    if (this.closed) return;
    const lockChanged = inputs.locked !== this.inputs.locked;
    this.inputs = inputs;
    if (lockChanged) for (const p of this.peers) p.sessionChanged?.();
    this.evaluator.changed(inputs);
  }

  /** Check → store → relay → evaluate, for every update that arrived since the last flush. */
  private async flush(): Promise<void> {
    this.flushQueued = false;
    // A connection that lost write access after sending (a role change, a lock) sends nothing more.
    const batch = this.incoming.splice(0).filter((item) => item.peer.mayWrite());
    const accepted: { peer: Peer; update: Uint8Array }[] = [];
    for (const item of batch) {
      let checked;
      try {
        checked = this.shadow.check(item.update, this.atomCount);
      } catch {
        item.peer.fail('The update could not be decoded.');
      }
      if (checked && 'added' in checked) {
        if (checked.added) accepted.push({ peer: item.peer, update: checked.added });
        continue; // (an update of nothing new needs neither storing nor relaying)
      }
      if (checked) item.peer.sendError({ code: 'update_refused', message: `Update refused: ${checked.problem.message}`, details: checked.problem });
      this.shadow.rebuild(this.doc, accepted.map((a) => a.update));
    }
    if (accepted.length === 0) return;
    const prevSeq = this.compactor.lastUpdateId;
    let lastSeq: number;
    try {
      lastSeq = await this.deps.storage.append(this.id, accepted.map((a) => ({ userId: a.peer.userId, data: a.update })));
    } catch (err) {
      // Nothing of the batch is stored or relayed. Its senders reconnect, and the sync on reconnecting
      // sends the server what it lacks.
      this.shadow.rebuild(this.doc);
      for (const peer of new Set(accepted.map((a) => a.peer))) peer.retry('The draft could not be stored just now; your changes are sent again on reconnecting.');
      throw err;
    }
    this.compactor.stored(lastSeq, accepted.length);
    // The batch's sequence numbers are consecutive and end at lastSeq (draft-storage.ts). Nothing else
    // runs between publishing and applying: the in-process relay delivers before publish returns.
    const first = lastSeq - accepted.length + 1;
    accepted.forEach(({ peer, update }, i) => {
      this.deps.relay.publish({ kind: 'update', mappingId: this.id, seq: first + i, prevSeq: i === 0 ? prevSeq : first + i - 1, update, instance: this.deps.instance, sender: peer.id });
    });
    for (const { peer, update } of accepted) Y.applyUpdate(this.doc, update, peer);
    this.evaluator.changed();
    if (this.compactor.uncompacted >= this.deps.options.compactEvery) void this.compactor.compact();
  }

  private onRelayed = (message: RelayedMessage): void => {
    if (this.closed) return;
    if (message.kind === 'awareness') return this.presence.relayed(message.update, message.instance === this.deps.instance);
    if (message.kind === 'gap') return this.queueCatchUp();
    if (message.kind === 'evaluation') {
      if (message.instance === this.deps.instance) return;
      this.evaluator.adopt(message.result);
      return this.sendAll(this.evaluationFrame(message.result));
    }
    this.followSequence(message);
    if (message.instance !== this.deps.instance) {
      // Stored and checked by another server's room.
      Y.applyUpdate(this.doc, message.update, RELAYED);
      this.shadow.apply(message.update);
      this.compactor.stored(Math.max(this.compactor.lastUpdateId, message.seq), 1);
      this.evaluator.changed();
    }
    const frame = syncUpdateFrame(message.update);
    const restore = message.restoreFor;
    for (const p of this.peers) {
      if (p.id === message.sender) continue;
      p.send(restore && p.userId === restore.userId && p.controlled.has(restore.clientId) ? restoreFrame(message.update) : frame);
    }
  };

  private followSequence(message: RelayedUpdate): void {
    if (!this.seen.has(message.prevSeq)) {
      this.gaps++;
      // Folding a document that lacks stored updates would drop them: no compaction until caught up.
      this.compactor.blocked = true;
      this.deps.log.warn({ mappingId: this.id, prevSeq: message.prevSeq, seq: message.seq }, 'relayed draft updates are missing: catching up from storage');
      this.queueCatchUp();
    }
    this.seen.note(message.seq);
  }

  /** One catch-up at a time, on the room's queue (after the updates queued before it). */
  private queueCatchUp(): void {
    if (this.catchUpQueued || this.closed) return;
    this.catchUpQueued = true;
    void this.serial(async () => {
      this.catchUpQueued = false;
      await this.catchUp();
    });
  }

  /**
   * Reads the stored draft and takes what this room's document lacks: applied, sent to every peer,
   * evaluated. Stored updates are checked ones (every server checks before storing), and applying
   * what the document already has changes nothing, so this is safe to run at any time.
   */
  private async catchUp(): Promise<void> {
    if (this.closed) return;
    const stored = await this.deps.storage.load(this.id, this.atomCount);
    const missing = Y.encodeStateAsUpdate(stored.doc, Y.encodeStateVector(this.doc));
    stored.doc.destroy();
    const changes: Uint8Array[] = [];
    const capture = (update: Uint8Array) => void changes.push(update);
    this.doc.on('update', capture);
    try {
      Y.applyUpdate(this.doc, missing, RELAYED);
    } finally {
      this.doc.off('update', capture);
    }
    this.seen.raise(stored.lastUpdateId);
    this.compactor.stored(Math.max(this.compactor.lastUpdateId, stored.lastUpdateId), 0);
    this.compactor.blocked = false;
    if (changes.length === 0 || this.closed) return;
    const update = changes.length === 1 ? changes[0] : Y.mergeUpdates(changes);
    this.caughtUp++;
    this.shadow.apply(update);
    this.evaluator.changed();
    this.sendAll(syncUpdateFrame(update));
  }

  private sendAll(frame: Uint8Array): void {
    for (const p of this.peers) p.send(frame);
  }

  private publishEvaluation(result: EvaluationResult, revision: number): void {
    this.sendAll(this.evaluationFrame(result));
    // With a lease, this server is the one evaluating edits: the other servers' connections get it too.
    if (this.deps.lease && revision > 0) this.deps.relay.publish({ kind: 'evaluation', mappingId: this.id, result, instance: this.deps.instance });
    if (revision === 0) return; // the room's first evaluation: nothing was edited
    this.rowTouch.edited(result.evaluation?.beads.length ?? this.draft().beads.length);
  }
}
