/**
 * Mapping proposals on hand-worked examples (the rules are ours, docs/chemistry.md "Mapping
 * proposals"; bead sizes are common practice, no source).
 */
import { describe, expect, it } from 'vitest';
import { parseMolecule } from '../../../server/chem/index';
import { proposePartitions } from '../../../server/chem/propose';
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
});
