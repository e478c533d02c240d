import { describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import {
  assignAtoms,
  atomsOf,
  beadsOf,
  createBead,
  deleteBead,
  docToMapping,
  mappingToDoc,
  mergeBeads,
  removeAtoms,
  renameBead,
  setCentre,
  setType,
  shareAtom,
  splitBead,
} from '../../src/shared/mapping-doc';
import { applyChecked, checkDoc } from '../../src/shared/mapping-doc-check';

const ATOMS = 10;

/** Two peers that exchange their full state, as the sync protocol would. */
function sync(...docs: Y.Doc[]): void {
  for (const a of docs) for (const b of docs) if (a !== b) Y.applyUpdate(b, Y.encodeStateAsUpdate(a, Y.encodeStateVector(b)));
}

/** The update a local edit produces, for feeding to applyChecked. */
function updateOf(base: Y.Doc, edit: (doc: Y.Doc) => void): Uint8Array {
  const doc = new Y.Doc();
  Y.applyUpdate(doc, Y.encodeStateAsUpdate(base));
  const before = Y.encodeStateVector(doc);
  edit(doc);
  return Y.encodeStateAsUpdate(doc, before);
}

describe('mapping document helpers', () => {
  it('creates beads and reads them back in the chemistry core’s form', () => {
    const doc = new Y.Doc();
    const a = createBead(doc, [3, 2], { id: 'bA' });
    const b = createBead(doc, [0, 1], { id: 'bB', type: 'water-loving 1, 4 atoms', centre: 'geometry' });
    expect(a).toBe('bA');
    expect(b).toBe('bB');
    expect(docToMapping(doc)).toEqual({
      beads: [
        { id: 'bB', name: 'B2', type: 'water-loving 1, 4 atoms', centre: 'geometry', atoms: [{ index: 0, weight: 1 }, { index: 1, weight: 1 }] },
        { id: 'bA', name: 'B1', centre: 'mass', atoms: [{ index: 2, weight: 1 }, { index: 3, weight: 1 }] },
      ],
    });
    expect(checkDoc(doc, ATOMS)).toBeNull();
  });

  it('moves, removes, shares, merges, splits, renames and deletes', () => {
    const doc = new Y.Doc();
    createBead(doc, [0, 1, 2], { id: 'x' });
    createBead(doc, [3, 4], { id: 'y' });
    assignAtoms(doc, 'y', [2]);
    expect(atomsOf(doc).get('2')).toEqual({ y: 1 });
    shareAtom(doc, 1, { x: 0.5, y: 0.5 });
    expect(docToMapping(doc).beads.find((b) => b.id === 'y')?.atoms).toEqual([
      { index: 1, weight: 0.5 },
      { index: 2, weight: 1 },
      { index: 3, weight: 1 },
      { index: 4, weight: 1 },
    ]);
    removeAtoms(doc, [4], 'y');
    expect(atomsOf(doc).has('4')).toBe(false);
    mergeBeads(doc, 'x', ['y']);
    expect(beadsOf(doc).has('y')).toBe(false);
    expect(atomsOf(doc).get('1')).toEqual({ x: 1 });
    const z = splitBead(doc, 'x', [2, 3], { id: 'z', name: 'Tail' });
    expect(docToMapping(doc).beads.map((b) => [b.name, b.atoms.map((a) => a.index)])).toEqual([
      ['B1', [0, 1]],
      ['Tail', [2, 3]],
    ]);
    renameBead(doc, z, 'T1');
    setType(doc, z, 'L2');
    setCentre(doc, z, 'geometry-heavy');
    expect(docToMapping(doc).beads[1]).toMatchObject({ name: 'T1', type: 'L2', centre: 'geometry-heavy' });
    deleteBead(doc, 'x');
    expect([...atomsOf(doc).keys()].sort()).toEqual(['2', '3']);
    expect(checkDoc(doc, ATOMS)).toBeNull();
  });

  it('refuses helper misuse instead of writing a bad document', () => {
    const doc = new Y.Doc();
    createBead(doc, [0], { id: 'x' });
    expect(() => shareAtom(doc, 0, { x: 0 })).toThrow(/\(0, 1\]/);
    expect(() => assignAtoms(doc, 'nope', [1])).toThrow(/No bead/);
  });

  it('round-trips a mapping through mappingToDoc', () => {
    const doc = new Y.Doc();
    createBead(doc, [0, 1], { id: 'p' });
    createBead(doc, [2], { id: 'q' });
    shareAtom(doc, 1, { p: 0.5, q: 0.5 });
    const copy = new Y.Doc();
    mappingToDoc(copy, docToMapping(doc));
    expect(docToMapping(copy)).toEqual(docToMapping(doc));
  });

  it('resolves the same atom assigned at once by two peers to one bead on both', () => {
    const [a, b, c] = [new Y.Doc(), new Y.Doc(), new Y.Doc()];
    createBead(a, [0], { id: 'ba' });
    createBead(b, [1], { id: 'bb' });
    sync(a, b, c);
    assignAtoms(a, 'ba', [5]);
    assignAtoms(b, 'bb', [5]);
    sync(a, b, c);
    const holders = [a, b, c].map((d) => Object.keys(atomsOf(d).get('5') ?? {}));
    expect(holders[0]).toHaveLength(1);
    expect(holders[1]).toEqual(holders[0]);
    expect(holders[2]).toEqual(holders[0]);
  });
});

describe('applyChecked', () => {
  const base = () => {
    const doc = new Y.Doc();
    createBead(doc, [0, 1], { id: 'x' });
    return doc;
  };
  const refused = (edit: (doc: Y.Doc) => void) => {
    const doc = base();
    return applyChecked(doc, updateOf(doc, edit), ATOMS);
  };

  it('accepts what the helpers write', () => {
    const doc = base();
    const update = updateOf(doc, (d) => {
      createBead(d, [2, 3]);
      shareAtom(d, 1, { x: 0.25, [beadsOf(d).keys().next().value as string]: 0.75 });
      deleteBead(d, 'x');
    });
    expect(applyChecked(doc, update, ATOMS)).toBeNull();
  });

  it('accepts a new bead on a copy that was built from an update alone', () => {
    const copy = new Y.Doc();
    Y.applyUpdate(copy, Y.encodeStateAsUpdate(base()));
    expect(applyChecked(copy, updateOf(copy, (d) => createBead(d, [5])), ATOMS)).toBeNull();
  });

  it.each([
    ['an unknown top-level name', (d: Y.Doc) => d.getMap('extra').set('k', 1), 'unknown_key'],
    ['list content at the top', (d: Y.Doc) => d.getArray('atoms').push([1]), 'wrong_type'],
    ['a bead that is not a map', (d: Y.Doc) => beadsOf(d).set('y', 'text' as never), 'wrong_type'],
    ['an unknown bead key', (d: Y.Doc) => beadsOf(d).get('x')!.set('colour', 'red'), 'unknown_key'],
    ['a bad centre rule', (d: Y.Doc) => beadsOf(d).get('x')!.set('centre', 'middle'), 'wrong_type'],
    ['an empty bead name', (d: Y.Doc) => beadsOf(d).get('x')!.set('name', ' '), 'wrong_type'],
    ['an atom index outside the molecule', (d: Y.Doc) => atomsOf(d).set('10', { x: 1 }), 'atom_out_of_range'],
    ['a non-integer atom key', (d: Y.Doc) => atomsOf(d).set('1.5', { x: 1 }), 'wrong_type'],
    ['a weight of zero', (d: Y.Doc) => atomsOf(d).set('2', { x: 0 }), 'weight_out_of_range'],
    ['a weight above one', (d: Y.Doc) => atomsOf(d).set('2', { x: 1.5 }), 'weight_out_of_range'],
    ['a weight that is text', (d: Y.Doc) => atomsOf(d).set('2', { x: '1' } as never), 'wrong_type'],
    ['an empty atom entry', (d: Y.Doc) => atomsOf(d).set('2', {}), 'wrong_type'],
    ['a nested Yjs type as atom entry', (d: Y.Doc) => atomsOf(d).set('2', new Y.Map() as never), 'wrong_type'],
  ])('refuses %s', (_what, edit, code) => {
    expect(refused(edit)?.code).toBe(code);
  });
});
