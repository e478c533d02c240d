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

  it('places the parts of a salt apart', async () => {
    const m = await parseMolecule({ smiles: 'CC(=O)[O-].[Na+]' });
    const xyz = await generateConformer(m, { seed: 1, maxIterations: 100 });
    const na = m.atoms.findIndex((a) => a.element === 'Na');
    const closest = Math.min(...xyz.filter((_, i) => i !== na).map((p) => dist(p, xyz[na])));
    expect(closest).toBeGreaterThan(3);
  }, 60_000);

  it('refuses a seed that is not a whole number', async () => {
    const m = await parseMolecule({ smiles: 'CCO' });
    await expect(generateConformer(m, { seed: 1.5 })).rejects.toBeInstanceOf(ChemError);
  });
});
