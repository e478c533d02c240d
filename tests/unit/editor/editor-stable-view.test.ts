import { describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { assignAtoms, createBead, renameBead } from '../../../src/shared/mapping-doc';
import { mappingView } from '../../../src/features/editor/model/bead-view';
import { keepUnchanged } from '../../../src/features/editor/model/stable-view';
import { chain } from './editor-fixture';

describe('keepUnchanged', () => {
  const bonds = chain(12);

  it('keeps the beads an edit left alone and replaces the ones it changed', () => {
    const doc = new Y.Doc();
    const a = createBead(doc, [0, 1], { name: 'A' });
    const b = createBead(doc, [4, 5], { name: 'B' });
    const before = mappingView(doc, bonds);
    assignAtoms(doc, b, [6]);
    const after = keepUnchanged(before, mappingView(doc, bonds));
    expect(after).not.toBe(before);
    expect(after.byId.get(a)).toBe(before.byId.get(a));
    expect(after.byId.get(b)).not.toBe(before.byId.get(b));
    expect(after.byId.get(b)!.atoms.map((x) => x.index)).toEqual([4, 5, 6]);
    expect(after.beads.map((x) => x.id)).toEqual([a, b]);
    expect(after.atomBeads.get(6)).toEqual([b]);
  });

  it('replaces a renamed bead and adds a new one, keeping the links when they did not change', () => {
    const doc = new Y.Doc();
    const a = createBead(doc, [0, 1], { name: 'A' });
    const before = mappingView(doc, bonds);
    renameBead(doc, a, 'A2');
    const c = createBead(doc, [8, 9], { name: 'C' });
    const after = keepUnchanged(before, mappingView(doc, bonds));
    expect(after.byId.get(a)).not.toBe(before.byId.get(a));
    expect(after.byId.get(a)!.name).toBe('A2');
    expect(after.byId.get(c)!.name).toBe('C');
    expect(after.links).toBe(before.links);
  });

  it('returns the previous view itself when nothing it shows changed', () => {
    const doc = new Y.Doc();
    createBead(doc, [0, 1, 2], { name: 'A' });
    const before = mappingView(doc, bonds);
    expect(keepUnchanged(before, mappingView(doc, bonds))).toBe(before);
  });

  it('takes new links when bonded beads appear', () => {
    const doc = new Y.Doc();
    createBead(doc, [0, 1], { name: 'A' });
    const before = mappingView(doc, bonds);
    createBead(doc, [2, 3], { name: 'B' });
    const after = keepUnchanged(before, mappingView(doc, bonds));
    expect(after.links).toHaveLength(1);
    expect(before.links).toHaveLength(0);
  });
});
