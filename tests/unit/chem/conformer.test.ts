import { describe, expect, it } from 'vitest';
import { ChemError, generateConformer, parseMolecule, type Molecule } from '../../../server/chem/index';
import { warmUpChemistry } from './warm-up';

warmUpChemistry();

const dist = (p: number[], q: number[]) => Math.hypot(p[0] - q[0], p[1] - q[1], p[2] - q[2]);

function hydrogenParents(m: Molecule): number[] {
  const parents: number[] = [];
  m.atoms.forEach((a, i) => {
    for (let k = 0; k < a.hydrogens; k++) parents.push(i);
  });
  return parents;
}

describe('generateConformer', () => {
  it('is reproducible for a seed and lists points in the contract order', async () => {
    const m = await parseMolecule({ smiles: 'OC(=O)C=C' });
    const a = await generateConformer(m, { seed: 7, maxIterations: 200 });
    const b = await generateConformer(m, { seed: 7, maxIterations: 200 });
    expect(b).toEqual(a);
    const parents = hydrogenParents(m);
    expect(a).toHaveLength(m.atoms.length + parents.length);
    // Each hydrogen sits at bonding distance from its own heavy atom (C–H ≈ 1.09 Å, O–H ≈ 0.97 Å;
    // textbook bond lengths), which fails if the hydrogen order were mixed up.
    parents.forEach((p, k) => {
      const d = dist(a[m.atoms.length + k], a[p]);
      expect(d).toBeGreaterThan(0.9);
      expect(d).toBeLessThan(1.2);
    });
    // Heavy-atom bonds at sensible lengths (C=C 1.34, C=O 1.21, C–C 1.48, C–O 1.35 Å; textbook values).
    for (const bond of m.bonds) {
      const d = dist(a[bond.a], a[bond.b]);
      expect(d).toBeGreaterThan(1.15);
      expect(d).toBeLessThan(1.6);
    }
  }, 60_000);

  it('puts a counter-ion in contact with its charged partner, nothing closer', async () => {
    // Contact distance = Shannon radius of the ion + 1.40 Å (ion-placement.ts): Na+ 1.02 → 2.42 Å.
    const m = await parseMolecule({ smiles: 'CC(=O)[O-].[Na+]' });
    const xyz = await generateConformer(m, { seed: 1, maxIterations: 100 });
    const na = m.atoms.findIndex((a) => a.element === 'Na');
    const oMinus = m.atoms.findIndex((a) => a.charge === -1);
    expect(dist(xyz[na], xyz[oMinus])).toBeCloseTo(2.42, 6);
    const others = xyz.filter((_, i) => i !== na && i !== oMinus).map((p) => dist(p, xyz[na]));
    expect(Math.min(...others)).toBeGreaterThan(2.0);
  }, 60_000);

  it('pairs free ions of a simple salt and shares out partners (CaCl2: two Cl- at 3.21 Å from Ca2+)', async () => {
    const nacl = await parseMolecule({ smiles: '[Na+].[Cl-]' });
    const a = await generateConformer(nacl, { seed: 1 });
    expect(dist(a[0], a[1])).toBeCloseTo(1.81 + 1.4, 6);
    const cacl2 = await parseMolecule({ smiles: '[Ca+2].[Cl-].[Cl-]' });
    const b = await generateConformer(cacl2, { seed: 1 });
    expect(dist(b[0], b[1])).toBeCloseTo(3.21, 6);
    expect(dist(b[0], b[2])).toBeCloseTo(3.21, 6);
    expect(dist(b[1], b[2])).toBeGreaterThan(3.5);
  }, 60_000);

  it('builds a repeat unit: attachment points sit where the next unit’s carbon would be', async () => {
    const m = await parseMolecule({ smiles: '*CC(*)c1ccccc1' });
    const xyz = await generateConformer(m, { seed: 3 });
    expect(xyz).toHaveLength(m.atoms.length + 8);
    expect(dist(xyz[0], xyz[1])).toBeGreaterThan(1.4);
    expect(dist(xyz[0], xyz[1])).toBeLessThan(1.65);
  }, 60_000);

  it('refuses a seed that is not a whole number', async () => {
    const m = await parseMolecule({ smiles: 'CCO' });
    await expect(generateConformer(m, { seed: 1.5 })).rejects.toBeInstanceOf(ChemError);
  });
});
