import { beforeAll, describe, expect, it } from 'vitest';
import { evaluateMapping, loadRdkit, parseMolecule } from '../../../server/chem/index';
import { maximumMatchings } from '../../../server/chem/fragments';
import type { RDKit } from '../../../server/chem/rdkit';
import { beadsFrom } from './helpers';
import { warmUpChemistry } from './warm-up';

// Fragment logP must not depend on the Kekulé structure a molecule was stored with (capping rule in
// server/chem/fragments.ts, docs/chemistry.md). Reference values: RDKit's own CrippenClogP
// (@rdkit/rdkit, an independent implementation of Wildman & Crippen 1999) of the capped fragment,
// written by hand as a SMILES in the comment beside each check.

warmUpChemistry();
let rd: RDKit;
beforeAll(async () => {
  rd = await loadRdkit();
});

function rdkitClogP(smiles: string): number {
  const mol = rd.get_mol(smiles)!;
  const v = (JSON.parse(mol.get_descriptors()) as { CrippenClogP: number }).CrippenClogP;
  mol.delete();
  return v;
}

const fragments = (ev: ReturnType<typeof evaluateMapping>) => ev.beads.map((b) => b.fragmentLogP!);

describe('fragment logP is independent of the Kekulé structure', () => {
  it('benzene in three 2-atom beads: every bead is ethene, in both rotations', async () => {
    const m = await parseMolecule({ smiles: 'c1ccccc1' });
    const ethene = rdkitClogP('C=C'); // each bead: two CH, each capped with one H, paired by a double bond
    for (const v of fragments(evaluateMapping(m, beadsFrom([[0, 1], [2, 3], [4, 5]])))) expect(v).toBeCloseTo(ethene, 10);
    for (const v of fragments(evaluateMapping(m, beadsFrom([[1, 2], [3, 4], [5, 0]])))) expect(v).toBeCloseTo(ethene, 10);
  });

  it('benzene in two 3-atom beads: propene either way the pair falls (C=CC and CC=C are one molecule)', async () => {
    const m = await parseMolecule({ smiles: 'C1=CC=CC=C1' });
    const propene = rdkitClogP('C=CC');
    for (const v of fragments(evaluateMapping(m, beadsFrom([[0, 1, 2], [3, 4, 5]])))) expect(v).toBeCloseTo(propene, 10);
    for (const v of fragments(evaluateMapping(m, beadsFrom([[1, 2, 3], [4, 5, 0]])))) expect(v).toBeCloseTo(propene, 10);
  });

  it('the two mirror-image ring beads of ibuprofen get equal values', async () => {
    // CC(C)Cc1ccc(cc1)C(C)C(=O)O: ring atoms 4 (ipso, CH2 side), 5, 6, 7 (ipso, acid side), 8, 9.
    const m = await parseMolecule({ smiles: 'CC(C)Cc1ccc(cc1)C(C)C(=O)O' });
    const ev = evaluateMapping(m, beadsFrom([[0, 1, 2, 3], [4, 5, 6], [7, 8, 9], [10, 11, 12, 13, 14]]));
    // Each ring bead: C(ipso) capped with two H (one for the side chain, one for the ring), two CH, the
    // last capped once; one double bond inside → propene, whichever end carries it.
    expect(ev.beads[1].fragmentLogP!).toBeCloseTo(rdkitClogP('C=CC'), 10);
    expect(ev.beads[2].fragmentLogP!).toBeCloseTo(ev.beads[1].fragmentLogP!, 12);
    // The other split of the same ring (mirror beads 4,5,9 and 6,7,8) agrees too.
    const other = evaluateMapping(m, beadsFrom([[0, 1, 2, 3], [4, 5, 9], [6, 7, 8], [10, 11, 12, 13, 14]]));
    expect(other.beads[1].fragmentLogP!).toBeCloseTo(other.beads[2].fragmentLogP!, 12);
  });

  it('one ring of naphthalene as a bead is benzene, whichever Kekulé form the SMILES was written in', async () => {
    const benzene = rdkitClogP('c1ccccc1');
    for (const smiles of ['c1ccc2ccccc2c1', 'C1=CC=C2C=CC=CC2=C1', 'C1=CC2=CC=CC=C2C=C1']) {
      const m = await parseMolecule({ smiles });
      // Atoms 0, 1, 2, 3, 8, 9 are one ring in the first two SMILES; the third numbers it 0, 1, 2, 7, 8, 9.
      const ring = smiles.startsWith('C1=CC2') ? [0, 1, 2, 7, 8, 9] : [0, 1, 2, 3, 8, 9];
      const rest = m.atoms.map((a) => a.index).filter((i) => !ring.includes(i));
      const ev = evaluateMapping(m, beadsFrom([ring, rest]));
      expect(ev.beads[0].fragmentLogP!).toBeCloseTo(benzene, 10);
      expect(ev.beads[1].fragmentLogP!).toBeCloseTo(rdkitClogP('C=CC=C'), 10); // the other four CH: buta-1,3-diene
    }
  });

  it('a bead that cuts no aromatic bond keeps the stored bonds (whole molecule = molecule logP)', async () => {
    const m = await parseMolecule({ smiles: 'Cc1ccc2ccccc2c1' });
    expect(evaluateMapping(m, beadsFrom([m.atoms.map((a) => a.index)])).beads[0].fragmentLogP!).toBeCloseTo(m.logP, 10);
  });

  it('pyridine cut next to N: the pairing is chosen on the fragment, not the stored Kekulé form', async () => {
    // n1ccccc1: atoms 0 (N), 1–5 (CH). Bead {0, 1}: N=CH2 capped → methanimine C=N (H on C: own 1 + cap 1).
    const m = await parseMolecule({ smiles: 'n1ccccc1' });
    const ev = evaluateMapping(m, beadsFrom([[0, 1], [2, 3], [4, 5]]));
    expect(ev.beads[0].fragmentLogP!).toBeCloseTo(rdkitClogP('C=N'), 10);
    const rotated = evaluateMapping(m, beadsFrom([[5, 0], [1, 2], [3, 4]]));
    expect(rotated.beads[0].fragmentLogP!).toBeCloseTo(ev.beads[0].fragmentLogP!, 12);
  });
});

describe('maximum matchings (the pairing step)', () => {
  it('finds every maximum matching of a path and of a hexagon (hand-counted)', () => {
    // Path 0–1–2: two matchings of size 1. Path 0–1–2–3: one of size 2. Hexagon: two of size 3.
    expect(maximumMatchings(3, [[0, 1], [1, 2]])).toEqual([[[0, 1]], [[1, 2]]]);
    expect(maximumMatchings(4, [[0, 1], [1, 2], [2, 3]])).toEqual([[[0, 1], [2, 3]]]);
    expect(maximumMatchings(6, [[0, 1], [1, 2], [2, 3], [3, 4], [4, 5], [0, 5]])).toHaveLength(2);
    expect(maximumMatchings(2, [])).toEqual([[]]);
  });
});
