import { describe, expect, it } from 'vitest';
import { createBead, docToMapping } from '../../../src/shared/mapping-doc';
import { freeIonAtoms } from '../../../src/shared/free-ions';
import { isAvailable, run } from '../../../src/features/editor/commands/registry';
import type { Atom, Bond } from '../../../src/shared/chem';
import { editorFixture } from './editor-fixture';

// Sodium acetate as the editor sees it: C–C(=O)O− and a free Na+ (atom 4).
const atom = (index: number, element: string, charge = 0): Atom => ({ index, element, isotope: null, charge, aromatic: false, hydrogens: 0, hydrogenIsotopes: [], radical: 0, x: 0, y: 0 });
const atoms = [atom(0, 'C'), atom(1, 'C'), atom(2, 'O'), atom(3, 'O', -1), atom(4, 'Na', 1)];
const bonds: Bond[] = [{ a: 0, b: 1, order: 1, aromatic: false }, { a: 1, b: 2, order: 2, aromatic: false }, { a: 1, b: 3, order: 1, aromatic: false }];

describe('free ions', () => {
  it('are the charged atoms bonded to nothing (the O− of acetate is not one)', () => {
    expect(freeIonAtoms({ atoms, bonds })).toEqual([4]);
    expect(freeIonAtoms({ atoms: [atom(0, 'Ca', 2), atom(1, 'Cl', -1), atom(2, 'Cl', -1)], bonds: [] })).toEqual([0, 1, 2]);
  });

  it('one command takes each free ion out of its bead into a bead of its own, in one undo step', () => {
    const f = editorFixture(5, bonds);
    const ctx = () => ({ ...f.ctx(), freeIons: freeIonAtoms({ atoms, bonds }) });
    createBead(f.doc, [0, 1, 2, 3, 4], { name: 'ALL' }, f.origin);
    const command = f.command('free-ions-to-beads');
    expect(isAvailable(command, ctx())).toBe(true);
    expect(run(command, ctx())).toBe(true);
    const beads = docToMapping(f.doc).beads.map((b) => b.atoms.map((a) => a.index));
    expect(beads).toEqual([[0, 1, 2, 3], [4]]);
    expect(isAvailable(command, ctx())).toBe(false); // nothing left to do
    f.undo.undo();
    expect(docToMapping(f.doc).beads.map((b) => b.atoms.map((a) => a.index))).toEqual([[0, 1, 2, 3, 4]]);
  });

  it('is unavailable read-only and without free ions', () => {
    const f = editorFixture(5, bonds);
    expect(isAvailable(f.command('free-ions-to-beads'), { ...f.ctx(), freeIons: [4], readOnly: true })).toBe(false);
    expect(isAvailable(f.command('free-ions-to-beads'), { ...f.ctx(), freeIons: [] })).toBe(false);
  });
});
