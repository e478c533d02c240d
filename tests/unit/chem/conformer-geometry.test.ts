/**
 * Conformer geometry at 150 heavy atoms: bond lengths against typical values (C–C between sp3 carbons
 * 1.53 Å, aromatic C–C 1.39 Å, C–H 1.09 Å; common practice, no source), RMS deviation under 0.03 Å.
 * Time is measured by `npm run bench:chem` (docs/benchmarks.md), not asserted here: the test machines are
 * shared.
 */
import { describe, expect, it } from 'vitest';
import { bondLengthStats } from '../../../server/chem/bond-stats';
import { generateConformer, parseMolecule } from '../../../server/chem/index';
import { warmUpChemistry } from './warm-up';

warmUpChemistry();

describe('conformer bond lengths', () => {
  it('the statistics are right on a hand-built geometry', () => {
    // Ethane with C–C 1.53 and every C–H 1.09 Å except one at 1.19: RMS over 7 bonds = 0.1 / √7.
    const m = { atoms: [0, 1].map((index) => ({ index, element: 'C', isotope: null, charge: 0, aromatic: false, hydrogens: 3, hydrogenIsotopes: [], radical: 0, x: 0, y: 0 })), bonds: [{ a: 0, b: 1, order: 1, aromatic: false }] };
    const h = (c: number[], d: number[]) => c.map((v, k) => v + d[k]);
    const xyz = [[0, 0, 0], [1.53, 0, 0], h([0, 0, 0], [0, 1.19, 0]), h([0, 0, 0], [0, -1.09, 0]), h([0, 0, 0], [0, 0, 1.09]), h([1.53, 0, 0], [0, 1.09, 0]), h([1.53, 0, 0], [0, -1.09, 0]), h([1.53, 0, 0], [0, 0, 1.09])];
    const s = bondLengthStats(m, xyz);
    expect(s.count).toBe(7);
    expect(s.rms).toBeCloseTo(0.1 / Math.sqrt(7), 10);
  });

  it('a 150-heavy-atom polymer: RMS deviation under 0.03 Å, every kind near its typical length', async () => {
    const smiles = 'C' + 'CC(c1ccccc1)CC(C(=O)O)COCCO'.repeat(8) + 'CCCCC';
    const m = await parseMolecule({ smiles });
    expect(m.heavyAtoms).toBe(150);
    const s = bondLengthStats(m, await generateConformer(m, { seed: 42 }));
    console.info(`conformer, 150 heavy atoms: bond-length RMS ${s.rms.toFixed(4)} Å; ${JSON.stringify(s.byKind)}`);
    expect(s.byKind['C-C'].count).toBeGreaterThan(30);
    expect(s.byKind['C:C'].count).toBe(48);
    expect(s.byKind['C-H'].count).toBeGreaterThan(100);
    expect(s.rms).toBeLessThan(0.03);
    for (const kind of ['C-C', 'C:C', 'C-H'] as const) expect(s.byKind[kind].rms, kind).toBeLessThan(0.03);
  }, 600_000);
});
