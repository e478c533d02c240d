import * as Y from 'yjs';

/** Peers that exchange their full state, as the sync protocol would. */
export function sync(...docs: Y.Doc[]): void {
  for (const a of docs) for (const b of docs) if (a !== b) Y.applyUpdate(b, Y.encodeStateAsUpdate(a, Y.encodeStateVector(b)));
}

/** The update a local edit of a copy of `base` produces, for feeding to applyChecked. */
export function updateOf(base: Y.Doc, edit: (doc: Y.Doc) => void): Uint8Array {
  const doc = new Y.Doc();
  Y.applyUpdate(doc, Y.encodeStateAsUpdate(base));
  const before = Y.encodeStateVector(doc);
  edit(doc);
  return Y.encodeStateAsUpdate(doc, before);
}
