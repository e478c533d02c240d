import * as Y from 'yjs';
import * as decoding from 'lib0/decoding';
import { messageYjsUpdate } from 'y-protocols/sync';
import { parseMolecule } from '../../../server/chem/index';
import { evaluateDraft, type EvaluationInputs } from '../../../server/drafts/evaluate-draft';
import { DraftRoom, type RoomDeps } from '../../../server/drafts/draft-room';
import { MemoryDraftStorage } from '../../../server/drafts/memory-draft-storage';
import { createInProcessRelay } from '../../../server/drafts/in-process-relay';
import { DEFAULT_COLLAB_OPTIONS } from '../../../server/drafts/room-options';
import type { DraftRelay, RelayedMessage } from '../../../server/drafts/draft-relay';
import type { Peer } from '../../../server/drafts/peer';
import type { CollabErrorMessage } from '../../../src/shared/collab-protocol';
import { MESSAGE_AWARENESS, MESSAGE_EVALUATION, MESSAGE_SYNC } from '../../../src/shared/collab-protocol';

// A room on the in-memory seams: MemoryDraftStorage, the in-process relay, and the real evaluation
// (evaluate-draft.ts, run in this test's thread instead of the evaluation thread). Every step the
// room takes is written to `events`, so a test can read the order.

export type Step = 'store' | 'relay' | 'evaluate';

export interface TestPeer extends Peer {
  /** Yjs updates this peer was sent, in order. */
  updates: Uint8Array[];
  /** Awareness updates this peer was sent. */
  presence: Uint8Array[];
  errors: CollabErrorMessage[];
  retries: string[];
  evaluations: number;
  /** Resolves at the next evaluation frame. */
  nextEvaluation(): Promise<void>;
}

let peers = 0;

export function testPeer(userId = 1): TestPeer {
  const waiting: (() => void)[] = [];
  const peer: TestPeer = {
    id: `peer-${++peers}`,
    userId,
    sessionId: null,
    controlled: new Set(),
    updates: [],
    presence: [],
    errors: [],
    retries: [],
    evaluations: 0,
    send(frame) {
      const d = decoding.createDecoder(frame);
      const type = decoding.readVarUint(d);
      if (type === MESSAGE_SYNC && decoding.readVarUint(d) === messageYjsUpdate) peer.updates.push(decoding.readVarUint8Array(d));
      if (type === MESSAGE_AWARENESS) peer.presence.push(decoding.readVarUint8Array(d));
      if (type === MESSAGE_EVALUATION) {
        peer.evaluations++;
        for (const w of waiting.splice(0)) w();
      }
    },
    sendError: (e) => void peer.errors.push(e),
    fail: (reason) => {
      throw new Error(`peer failed: ${reason}`);
    },
    retry: (reason) => void peer.retries.push(reason),
    mayWrite: () => true,
    reconsider: () => {},
    nextEvaluation: () => new Promise((resolve) => waiting.push(resolve)),
  };
  return peer;
}

/** The molecule of every room here: 1-propanol, atoms C0 C1 C2 O3 (openchemlib keeps the SMILES order). */
export async function propanolInputs(mappingId = 1): Promise<EvaluationInputs> {
  const model = await parseMolecule({ smiles: 'CCCO' });
  return { mappingId, moleculeId: 1, projectId: 1, locked: false, resolution: '2:1', model, xyz: null, library: undefined };
}

export interface Kit {
  room: DraftRoom;
  storage: MemoryDraftStorage;
  relay: DraftRelay;
  events: Step[];
  published: RelayedMessage[];
  evaluations: () => number;
}

export async function openRoom(inputs: EvaluationInputs, overrides: Partial<RoomDeps> = {}, storage = new MemoryDraftStorage()): Promise<Kit> {
  const events: Step[] = [];
  const published: RelayedMessage[] = [];
  const inner = overrides.relay ?? createInProcessRelay((err) => {
    throw err;
  });
  const relay: DraftRelay = {
    publish(m) {
      if (m.kind === 'update') events.push('relay');
      published.push(m);
      inner.publish(m);
    },
    subscribe: (id, l) => inner.subscribe(id, l),
    close: () => inner.close(),
  };
  const before = storage.beforeAppend;
  storage.beforeAppend = async (id, updates) => {
    await before?.(id, updates);
    events.push('store');
  };
  let evaluated = 0;
  const room = await DraftRoom.open(
    {
      storage,
      relay,
      evaluation: {
        evaluate: async (i, _stamp, draft) => {
          events.push('evaluate');
          evaluated++;
          return evaluateDraft(i, draft);
        },
        forget: () => {},
      },
      loadInputs: async () => inputs,
      log: { error: () => {}, warn: () => {} } as never,
      instance: 'this-server',
      options: { ...DEFAULT_COLLAB_OPTIONS, evaluationDelayMs: 5, evaluationMaxWaitMs: 10 },
      ...overrides,
    },
    inputs.mappingId,
  );
  if (!room) throw new Error('no room');
  return { room, storage, relay, events, published, evaluations: () => evaluated };
}

/** An update from a client that has synced with `base`: `edit` applied on a copy of it. */
export function updateOn(base: Y.Doc, edit: (doc: Y.Doc) => void): Uint8Array {
  const doc = new Y.Doc();
  Y.applyUpdate(doc, Y.encodeStateAsUpdate(base));
  const before = Y.encodeStateVector(doc);
  edit(doc);
  return Y.encodeStateAsUpdate(doc, before);
}

/** Resolves once everything queued on the room so far has run. */
export const drained = (room: DraftRoom) => room.serial(() => undefined);
