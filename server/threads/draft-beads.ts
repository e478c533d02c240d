import * as Y from 'yjs';
import { BEADS, beadsOf, readBead } from '../../src/shared/mapping-doc';
import type { DraftAccess } from '../mappings/draft-access';

/**
 * Which bead ids a mapping has, now and ever. The rule for "a bead the mapping had":
 *   1. a bead in the draft now, or
 *   2. a key the draft's `beads` map has ever held: the stored draft (compacted snapshot plus the
 *      appended updates, drafts/drafts.service.ts) keeps a deleted map entry as a tombstone item that
 *      still carries its key, so decoding the stored state lists every bead id it ever had; or
 *   3. a bead of any saved version of the mapping (mapping_versions, threads.service.ts); or
 *   4. a bead id in Beadloom's own record, `thread_beads` (every bead a thread was started on).
 * Every accepted update is stored before it is relayed, so MariaDB's draft is the live one.
 */
export interface DraftBeads {
  /** Beads in the draft now: id → name. */
  current: Map<string, string>;
  /** Every bead id the stored draft history has held (current ones included). */
  ever: Set<string>;
}

/** Keys ever set on the top-level `beads` map in a Yjs update, deleted ones included. */
export function beadIdsInUpdate(update: Uint8Array): Set<string> {
  const ids = new Set<string>();
  for (const s of Y.decodeUpdate(update).structs) {
    // In a decoded update a top-level type is named by its key, so `parent` is the string here.
    if (s instanceof Y.Item && (s.parent as unknown) === BEADS && typeof s.parentSub === 'string') ids.add(s.parentSub);
  }
  return ids;
}

export function beadsOfDoc(doc: Y.Doc): DraftBeads {
  const current = new Map<string, string>();
  beadsOf(doc).forEach((_m, id) => current.set(id, readBead(doc, id)?.name ?? ''));
  const ever = beadIdsInUpdate(Y.encodeStateAsUpdate(doc));
  for (const id of current.keys()) ever.add(id);
  return { current, ever };
}

/** The stored draft's beads, computed once per stored state of the draft (drafts/stored-drafts.ts). */
export async function draftBeads(drafts: DraftAccess, mappingId: number): Promise<DraftBeads> {
  return (await drafts.storedDerived(mappingId, 'thread-beads', beadsOfDoc)) ?? { current: new Map(), ever: new Set() };
}
