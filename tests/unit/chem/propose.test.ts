/**
 * Mapping proposals on hand-worked examples (the rules are ours, docs/chemistry.md "Mapping
 * proposals"; bead sizes are common practice, no source).
 */
import { describe, expect, it } from 'vitest';
import { parseMolecule } from '../../../server/chem/index';
import { proposePartitions } from '../../../server/chem/propose';
import { asymmetricClasses } from '../../../server/chem/propose-cost';
import { warmUpChemistry } from './warm-up';

warmUpChemistry();

const best = async (smiles: string, resolution: '4:1' | '3:1' | '2:1' = '4:1', fixed: number[] = []) => {
  const m = await parseMolecule({ smiles });
  return proposePartitions(m, { resolution, fixed })[0].beads.map((b) => b.atoms);
};

describe('mapping proposals', () => {
  it('cuts benzene into three beads of two atoms', async () => {
    expect(await best('c1ccccc1')).toEqual([[0, 1], [2, 3], [4, 5]]);
  });

  it('maps sodium dodecyl sulfate as three C4 beads, the whole sulfate and the free ion', async () => {
    // Atoms 0–11 the chain, 12 the ester O, 13 S, 14–16 the other O, 17 Na+.
    expect(await best('CCCCCCCCCCCCOS(=O)(=O)[O-].[Na+]')).toEqual([[0, 1, 2, 3], [4, 5, 6, 7], [8, 9, 10, 11], [12, 13, 14, 15, 16], [17]]);
  });

  it('keeps a carboxylate whole and gives hexane two symmetric beads of three', async () => {
    const hexane = await best('CCCCCC');
    expect(hexane).toEqual([[0, 1, 2], [3, 4, 5]]);
    const valerate = await best('CCCCC(=O)[O-]');
    const carboxylate = valerate.find((b) => b.includes(4))!;
    expect(carboxylate).toEqual(expect.arrayContaining([4, 5, 6]));
  });

  it('completes a partial mapping around the atoms already decided', async () => {
    // Octane with atoms 0–3 already in a bead: the proposal covers 4–7 only.
    expect(await best('CCCCCCCC', '4:1', [0, 1, 2, 3])).toEqual([[4, 5, 6, 7]]);
  });

  it('returns the best proposal first and at most two alternatives, each with its cost', async () => {
    const m = await parseMolecule({ smiles: 'CC(C)Cc1ccc(cc1)C(C)C(=O)O' });
    const list = proposePartitions(m, { resolution: '4:1' });
    expect(list.length).toBeGreaterThanOrEqual(1);
    expect(list.length).toBeLessThanOrEqual(3);
    for (let i = 1; i < list.length; i++) expect(list[i].cost).toBeGreaterThanOrEqual(list[i - 1].cost);
    for (const p of list) expect(p.beads.flatMap((b) => b.atoms).sort((a, b) => a - b)).toEqual(m.atoms.map((_, i) => i));
  });

  it('cuts p-xylene at 2:1 into four symmetric beads: each methyl with its ring carbon, two ring CH pairs', async () => {
    // Atoms: 0 CH3, 1 C, 2 CH, 3 CH, 4 C, 5 CH3, 6 CH, 7 CH (worked by hand: the only symmetric cut
    // into beads of two).
    expect(await best('Cc1ccc(C)cc1', '2:1')).toEqual([[0, 1], [2, 3], [4, 5], [6, 7]]);
  });

  it('maps adamantane at 4:1 as four beads, each a CH with its three CH2 at one half', async () => {
    // C1C2CC3CC1CC(C2)C3: the CH are atoms 1, 3, 5, 7 (three heavy neighbours each), the CH2 the rest.
    const m = await parseMolecule({ smiles: 'C1C2CC3CC1CC(C2)C3' });
    const [top] = proposePartitions(m, { resolution: '4:1' });
    expect(top.beads).toHaveLength(4);
    const ch = [1, 3, 5, 7];
    for (const b of top.beads) {
      const centre = b.atoms.filter((a) => ch.includes(a));
      expect(centre).toHaveLength(1);
      expect(b.atoms).toHaveLength(4);
      b.atoms.forEach((a, k) => expect(b.weights![k]).toBe(ch.includes(a) ? 1 : 0.5));
      // The three CH2 are exactly the CH's neighbours in the molecule.
      const nbrs = m.bonds.filter((x) => x.a === centre[0] || x.b === centre[0]).map((x) => (x.a === centre[0] ? x.b : x.a)).sort((x, y) => x - y);
      expect(b.atoms.filter((a) => a !== centre[0])).toEqual(nbrs);
    }
    // At 2:1 six beads, each a CH2 with its two CH at one third (10 atoms / 6 beads ≈ 1.67 heavy atoms).
    const [fine] = proposePartitions(m, { resolution: '2:1' });
    expect(fine.beads).toHaveLength(6);
    for (const b of fine.beads) expect(b.weights!.slice().sort()).toEqual([1 / 3, 1 / 3, 1]);
  });

  it('maps cyclopentane symmetrically: one bead at 4:1 and 3:1, five one-atom beads at 2:1', async () => {
    expect(await best('C1CCCC1', '4:1')).toEqual([[0, 1, 2, 3, 4]]);
    expect(await best('C1CCCC1', '3:1')).toEqual([[0, 1, 2, 3, 4]]);
    expect(await best('C1CCCC1', '2:1')).toEqual([[0], [1], [2], [3], [4]]);
    // The asymmetric 2 + 3 cut is still offered as an alternative.
    const m = await parseMolecule({ smiles: 'C1CCCC1' });
    expect(proposePartitions(m, { resolution: '3:1' }).slice(1).map((p) => p.beads.map((b) => b.atoms.length).sort())).toContainEqual([2, 3]);
  });

  it('shares the middle atom where that is the symmetric way to reach the size (pentane at 3:1) and keeps a charged atom whole', async () => {
    const m = await parseMolecule({ smiles: 'CCCCC' });
    const [top] = proposePartitions(m, { resolution: '3:1' });
    expect(top.beads.map((b) => [b.atoms, b.weights])).toEqual([[[0, 1, 2], [1, 1, 0.5]], [[2, 3, 4], [0.5, 1, 1]]]);
    // Per connected part: in a mixture only the pentane is cut anew; hexane keeps its two beads of three,
    // and SDS at 3:1 (its 5-atom sulfate is over the limit, so its part is tried) keeps its own cut.
    const mix = await parseMolecule({ smiles: 'CCCCC.CCCCCC' });
    expect(proposePartitions(mix, { resolution: '3:1' })[0].beads.map((b) => [b.atoms, b.weights ?? null])).toEqual([[[0, 1, 2], [1, 1, 0.5]], [[2, 3, 4], [0.5, 1, 1]], [[5, 6, 7], null], [[8, 9, 10], null]]);
    expect(await best('CCCCCCCCCCCCOS(=O)(=O)[O-].[Na+]', '3:1')).toEqual([[0, 1, 2], [3, 4, 5], [6, 7, 8], [9, 10, 11], [12, 13, 14, 15, 16], [17]]);
    // Triethylammonium: the charged N is never shared (three ethyls sharing it would be symmetric).
    const salt = await parseMolecule({ smiles: 'CC[NH+](CC)CC' });
    for (const r of ['4:1', '3:1', '2:1'] as const) {
      const n = salt.atoms.findIndex((a) => a.element === 'N');
      const holders = proposePartitions(salt, { resolution: r })[0].beads.filter((b) => b.atoms.includes(n));
      expect(holders).toHaveLength(1);
      expect(holders[0].weights?.[holders[0].atoms.indexOf(n)] ?? 1).toBe(1);
    }
  });

  it('judges symmetry with shared atoms by each atom\'s beads and weights', () => {
    // Four atoms of one class on a ring a–b–c–d: beads on the bonds a–b and c–d are symmetric; beads
    // {a, b, c@½} and {c@½, d} are not (c is split, a is whole).
    const classes = Int32Array.from([0, 0, 0, 0]);
    expect(asymmetricClasses([[0, 1], [2, 3]], classes)).toEqual([]);
    expect(asymmetricClasses([[0, 1, 2], [2, 3]], classes, [[1, 1, 0.5], [0.5, 1]])).toEqual([0]);
    expect(asymmetricClasses([[0, 1], [1, 2], [2, 3], [3, 0]], classes, [[0.5, 0.5], [0.5, 0.5], [0.5, 0.5], [0.5, 0.5]])).toEqual([]);
  });
});
