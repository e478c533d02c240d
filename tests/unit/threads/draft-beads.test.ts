import { describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { beadsOfDoc } from '../../../server/threads/draft-beads';
import { beadsOf, mappingToDoc } from '../../../src/shared/mapping-doc';

const bead = (id: string, name: string, index: number) => ({ id, name, centre: 'mass' as const, atoms: [{ index, weight: 1 }] });

describe('bead ids a draft has had', () => {
  it('lists current beads with names, and deleted ones after a compaction (gc) round trip', () => {
    const doc = new Y.Doc({ gc: true });
    mappingToDoc(doc, { beads: [bead('b1', 'Head', 0), bead('b2', 'Tail', 1)] });
    beadsOf(doc).delete('b1');
    const compacted = new Y.Doc({ gc: true });
    Y.applyUpdate(compacted, Y.encodeStateAsUpdate(doc));

    const { current, ever } = beadsOfDoc(compacted);
    expect([...current]).toEqual([['b2', 'Tail']]);
    expect([...ever].sort()).toEqual(['b1', 'b2']);
  });

  it('knows nothing of ids that were never in the draft', () => {
    const doc = new Y.Doc();
    mappingToDoc(doc, { beads: [bead('b1', 'Head', 0)] });
    expect(beadsOfDoc(doc).ever.has('b9')).toBe(false);
    expect(beadsOfDoc(new Y.Doc()).ever.size).toBe(0);
  });
});
