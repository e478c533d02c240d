import { beforeAll, describe, expect, it } from 'vitest';
import { parseMolecule } from '../../../server/chem';
import { cleanLayout, closePairs, medianBondLength } from '../../../server/chem/layout-cleanup';

// Issue 13, point 6: in the 2D drawing no two atoms are closer than 0.5 × the median bond length
// (rule of the trade for a readable depiction: common practice, no source). Our own test molecules.

/** Polystyrene 18-mer with a butyl and an ethyl end: 4 + 18 × 8 + 2 = 150 heavy atoms. */
const POLYSTYRENE_150 = 'CCCC' + 'CC(c1ccccc1)'.repeat(18) + 'CC';
const MOLECULES: [string, string][] = [
  ['polystyrene 18-mer (150 heavy atoms)', POLYSTYRENE_150],
  ['disulfonated azo dye, two Na+', 'Nc1ccc(cc1)N=Nc1ccc(cc1S(=O)(=O)[O-])S(=O)(=O)[O-].[Na+].[Na+]'],
  ['a phosphatidylcholine (16:0/18:1)', 'CCCCCCCCCCCCCCCC(=O)OCC(COP(=O)([O-])OCC[N+](C)(C)C)OC(=O)CCCCCCC/C=C\\CCCCCCCC'],
  ['a β-blocker (propranolol)', 'CC(C)NCC(O)COc1cccc2ccccc12'],
  ['ibuprofen', 'CC(C)Cc1ccc(cc1)C(C)C(=O)O'],
  ['styrene–acrylic acid–ethylene oxide polymer ×5', 'C' + 'CC(c1ccccc1)CC(C(=O)O)COCCO'.repeat(5) + 'C'],
  // 704 heavy atoms: above layout-chunks.ts's 300, so laid out in pieces joined at chain bonds.
  ['the same polymer ×39 (laid out in pieces)', 'C' + 'CC(c1ccccc1)CC(C(=O)O)COCCO'.repeat(39) + 'C'],
  // 4 + 240 × 8 + 2 = 1,926 heavy atoms: openchemlib's inventor in one piece left 440 pairs closer than half a bond.
  ['polystyrene 240-mer (1,926 heavy atoms, laid out in pieces)', 'CCCC' + 'CC(c1ccccc1)'.repeat(240) + 'CC'],
  ['the styrene–acrylic acid–ethylene oxide polymer ×111 (2,000 heavy atoms)', 'C' + 'CC(c1ccccc1)CC(C(=O)O)COCCO'.repeat(111) + 'C'],
];

function minimumRatio(atoms: { x: number; y: number }[], bonds: { a: number; b: number }[]): number {
  const median = medianBondLength(atoms, bonds);
  let min = Infinity;
  for (let i = 0; i < atoms.length; i++) for (let j = i + 1; j < atoms.length; j++) min = Math.min(min, Math.hypot(atoms[i].x - atoms[j].x, atoms[i].y - atoms[j].y));
  return min / median;
}

beforeAll(async () => {
  await parseMolecule({ smiles: 'CCO' }); // loads RDKit's WebAssembly once
}, 60_000);

describe('2D layout', () => {
  it.each(MOLECULES)('keeps every pair of atoms of %s at least 0.5 × the median bond length apart', async (_name, smiles) => {
    const m = await parseMolecule({ smiles });
    // Every pair measured directly (not with the clean-up's own grid search).
    expect(minimumRatio(m.atoms, m.bonds)).toBeGreaterThanOrEqual(0.5);
    // And the drawing is still a drawing: every bond near the one bond length (openchemlib itself
    // squeezes a few ring bonds of the crowded polystyrene to ~0.83).
    for (const b of m.bonds) {
      const d = Math.hypot(m.atoms[b.a].x - m.atoms[b.b].x, m.atoms[b.a].y - m.atoms[b.b].y);
      expect(d).toBeGreaterThan(0.75);
      expect(d).toBeLessThan(1.25);
    }
  }, 120_000);

  it('has 150 heavy atoms in the polystyrene', async () => {
    expect((await parseMolecule({ smiles: POLYSTYRENE_150 })).atoms).toHaveLength(150);
  }, 60_000);

  it('moves a branch drawn onto another atom away, keeping every bond length', () => {
    // A hand-made clash: hexane's zigzag with its last two atoms folded back onto the first.
    const atoms = [
      { x: 0, y: 0 },
      { x: 0.87, y: 0.5 },
      { x: 1.73, y: 0 },
      { x: 1.73, y: -1 },
      { x: 0.87, y: -1.5 },
      { x: 0.1, y: -0.1 },
    ];
    const bonds = [0, 1, 2, 3, 4].map((a) => ({ a, b: a + 1 }));
    expect(closePairs(atoms, bonds, 0.5)).toEqual([[0, 5]]);
    const fixed = cleanLayout(atoms, bonds);
    expect(minimumRatio(fixed, bonds)).toBeGreaterThanOrEqual(0.5);
    for (const b of bonds) {
      const before = Math.hypot(atoms[b.a].x - atoms[b.b].x, atoms[b.a].y - atoms[b.b].y);
      expect(Math.hypot(fixed[b.a].x - fixed[b.b].x, fixed[b.a].y - fixed[b.b].y)).toBeCloseTo(before, 9);
    }
  });
});
