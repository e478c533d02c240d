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

  it('the same polymer: tetrahedral and ring angles, flat rings, no atoms on top of each other', async () => {
    // Checks the bond statistics do not see (typical values; common practice, no source): C–C–C at an
    // sp3 carbon 109.5° (each within 100–120°, mean within 3°), benzene's para carbons 2 × 1.39 = 2.78 Å apart
    // when the ring is flat, and no two heavy atoms three or more bonds apart closer than 2.4 Å.
    const m = await parseMolecule({ smiles: 'C' + 'CC(c1ccccc1)CC(C(=O)O)COCCO'.repeat(8) + 'CCCCC' });
    const xyz = await generateConformer(m, { seed: 7 });
    const nb: number[][] = m.atoms.map(() => []);
    for (const b of m.bonds) {
      nb[b.a].push(b.b);
      nb[b.b].push(b.a);
    }
    const d = (i: number, j: number) => Math.hypot(xyz[i][0] - xyz[j][0], xyz[i][1] - xyz[j][1], xyz[i][2] - xyz[j][2]);
    const sp3 = (i: number) => m.atoms[i].element === 'C' && !m.atoms[i].aromatic && m.bonds.every((b) => (b.a !== i && b.b !== i) || (b.order === 1 && !b.aromatic));
    const angles: number[] = [];
    m.atoms.forEach((_, j) => {
      if (!sp3(j)) return;
      const cs = nb[j].filter((i) => m.atoms[i].element === 'C');
      for (let x = 0; x < cs.length; x++) for (let y = x + 1; y < cs.length; y++) {
        const [a, c] = [cs[x], cs[y]];
        angles.push((Math.acos((d(a, j) ** 2 + d(c, j) ** 2 - d(a, c) ** 2) / (2 * d(a, j) * d(c, j))) * 180) / Math.PI);
      }
    });
    expect(angles.length).toBeGreaterThan(40);
    for (const a of angles) expect(a).toBeGreaterThan(100);
    for (const a of angles) expect(a).toBeLessThan(120);
    expect(Math.abs(angles.reduce((s, a) => s + a, 0) / angles.length - 109.5)).toBeLessThan(3);
    // Para carbons of each benzene ring: walk three aromatic bonds from each ring atom.
    let para = 0;
    m.atoms.forEach((a, i) => {
      if (!a.aromatic) return;
      const ring = (from: number, prev: number, left: number): number[] => (left === 0 ? [from] : nb[from].filter((j) => j !== prev && m.atoms[j].aromatic).flatMap((j) => ring(j, from, left - 1)));
      for (const p of new Set(ring(i, -1, 3))) {
        if (p === i) continue;
        para++;
        expect(d(i, p)).toBeCloseTo(2.78, 1);
      }
    });
    expect(para).toBe(48);
    // Topological distance by breadth-first search, then every far pair's distance.
    for (let i = 0; i < m.atoms.length; i++) {
      const hops = new Map([[i, 0]]);
      let frontier = [i];
      for (let h = 1; h <= 2; h++) {
        frontier = frontier.flatMap((u) => nb[u].filter((v) => !hops.has(v)));
        for (const v of frontier) hops.set(v, h);
      }
      for (let j = i + 1; j < m.atoms.length; j++) if (!hops.has(j)) expect(d(i, j), `atoms ${i + 1} and ${j + 1}`).toBeGreaterThan(2.4);
    }
  }, 600_000);
});
