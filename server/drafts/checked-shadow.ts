import * as Y from 'yjs';
import { applyCheckedUpdate, type DocProblem } from '../../src/shared/mapping-doc-check';

/**
 * The room checks an update by applying it to a copy of its document (the shadow) and looking at what
 * it changed (src/shared/mapping-doc-check.ts); the real document only ever gets accepted updates.
 * After a refusal the shadow may hold the refused update, so it is rebuilt from the document and the
 * updates accepted since. What an accepted update added is taken as the shadow encodes it, and that is
 * what the room stores and relays (mapping-doc-check.ts says why).
 */
export class CheckedShadow {
  private shadow: Y.Doc;

  constructor(
    doc: Y.Doc,
    private readonly maxBytes: number,
  ) {
    this.shadow = copyOf(doc);
  }

  /**
   * The problem of `update`, or what it added when it is accepted (the shadow then holds it; null when
   * it added nothing new). Throws when `update` is not a Yjs update; the caller then rebuilds the shadow.
   */
  check(update: Uint8Array, atomCount: number): { problem: DocProblem } | { added: Uint8Array | null } {
    const { problem, added } = applyCheckedUpdate(this.shadow, update, atomCount, { maxBytes: this.maxBytes });
    return problem ? { problem } : { added };
  }

  /** An update the document got without a check here (a restore the server made). */
  apply(update: Uint8Array): void {
    Y.applyUpdate(this.shadow, update);
  }

  /** Back to `doc` plus `accepted` (applied in order). */
  rebuild(doc: Y.Doc, accepted: Uint8Array[] = []): void {
    this.shadow.destroy();
    this.shadow = copyOf(doc, accepted);
  }
}

export function copyOf(doc: Y.Doc, extra: Uint8Array[] = []): Y.Doc {
  const copy = new Y.Doc();
  Y.applyUpdate(copy, Y.encodeStateAsUpdate(doc));
  for (const u of extra) Y.applyUpdate(copy, u);
  return copy;
}
