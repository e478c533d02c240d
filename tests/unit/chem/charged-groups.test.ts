import { describe, expect, it } from 'vitest';
import { evaluateMapping, parseMolecule, type Molecule } from '../../../server/chem/index';
import { chargedGroups, isChargedSpecies } from '../../../server/chem/charged-groups';
import { prepare } from '../../../server/chem/prepared';
import { beadsFrom } from './helpers';
import { warmUpChemistry } from './warm-up';

// Hand-worked examples of the charged-group rule (ours, server/chem/charged-groups.ts and
// docs/chemistry.md). Each expected group was worked out by hand from the structure; the atom indices
// are the chemistry core's (openchemlib's order, which for these SMILES is the order of the string).

warmUpChemistry();

const groupsOf = async (smiles: string) => {
  const m = await parseMolecule({ smiles });
  return { m, groups: chargedGroups(m, prepare(m)) };
};
const splitChecks = (m: Molecule, groups: number[][]) => evaluateMapping(m, beadsFrom(groups), { fragments: false }).checks.filter((c) => c.code === 'split_charged_group');

describe('charged groups (rule by rule, hand-worked)', () => {
  it('rule 2: carboxylate = C and both O (resonance)', async () => {
    const { groups } = await groupsOf('CCCC(=O)[O-]'); // 3 C, 4 =O, 5 O⁻
    expect(groups).toEqual([{ atoms: [3, 4, 5], netCharge: -1 }]);
  });

  it('rule 2: sulfonate = S and three O; phosphate dianion = P and its three O without H (ester O stays out)', async () => {
    expect((await groupsOf('CCS(=O)(=O)[O-]')).groups).toEqual([{ atoms: [2, 3, 4, 5], netCharge: -1 }]);
    expect((await groupsOf('COP(=O)([O-])[O-]')).groups).toEqual([{ atoms: [2, 3, 4, 5], netCharge: -2 }]);
  });

  it('rule 2 does not apply without a partner: phenoxide O⁻ stands alone', async () => {
    expect((await groupsOf('c1ccccc1[O-]')).groups).toEqual([{ atoms: [6], netCharge: -1 }]);
  });

  it('rule 3: guanidinium = C and three N; amidinium = C and two N', async () => {
    expect((await groupsOf('NC(=[NH2+])NCC')).groups).toEqual([{ atoms: [0, 1, 2, 3], netCharge: 1 }]);
    expect((await groupsOf('CC(=[NH2+])N')).groups).toEqual([{ atoms: [1, 2, 3], netCharge: 1 }]);
  });

  it('rule 1 + 2: nitro = N⁺, O⁻ and the =O, net charge 0; N-oxide = N⁺ and O⁻', async () => {
    expect((await groupsOf('c1ccccc1[N+](=O)[O-]')).groups).toEqual([{ atoms: [6, 7, 8], netCharge: 0 }]);
    expect((await groupsOf('C[N+](C)(C)[O-]')).groups).toEqual([{ atoms: [1, 4], netCharge: 0 }]);
  });

  it('rule 4: quaternary and protonated ammonium are the centre only', async () => {
    expect((await groupsOf('C[N+](C)(C)CC')).groups).toEqual([{ atoms: [1], netCharge: 1 }]);
    expect((await groupsOf('CCC[NH3+]')).groups).toEqual([{ atoms: [3], netCharge: 1 }]);
  });

  it('a salt has one group per ion', async () => {
    const { groups } = await groupsOf('CCCCCCCCCCCCOS(=O)(=O)[O-].[Na+]');
    expect(groups).toEqual([{ atoms: [13, 14, 15, 16], netCharge: -1 }, { atoms: [17], netCharge: 1 }]);
  });
});

describe('split_charged_group reports only real splits', () => {
  it('a whole NH₃⁺ or O⁻ alone in its bead is not split', async () => {
    const amine = await parseMolecule({ smiles: 'CCC[NH3+]' });
    expect(splitChecks(amine, [[0, 1, 2], [3]])).toEqual([]);
    const phenoxide = await parseMolecule({ smiles: 'c1ccccc1[O-]' });
    expect(splitChecks(phenoxide, [[0, 1, 2], [3, 4, 5], [6]])).toEqual([]);
  });

  it('a split guanidinium, nitro group and N-oxide are reported, with 1-based atom numbers', async () => {
    const gua = await parseMolecule({ smiles: 'NC(=[NH2+])NCC' });
    const g = splitChecks(gua, [[0, 1, 2], [3, 4, 5]]);
    expect(g).toHaveLength(1);
    expect(g[0].atoms).toEqual([0, 1, 2, 3]);
    expect(g[0].message).toContain('atoms 1, 2, 3, 4');
    expect(g[0].message).toContain('net charge +1');
    const nitro = await parseMolecule({ smiles: 'c1ccccc1[N+](=O)[O-]' });
    const n = splitChecks(nitro, [[0, 1, 2, 3, 4, 5, 6], [7, 8]]);
    expect(n).toHaveLength(1);
    expect(n[0].message).toMatch(/charge-separated/);
    const oxide = await parseMolecule({ smiles: 'C[N+](C)(C)[O-]' });
    expect(splitChecks(oxide, [[0, 1, 2, 3], [4]])).toHaveLength(1);
    expect(splitChecks(oxide, [[0, 2, 3], [1, 4]])).toEqual([]);
  });

  it('a quaternary centre is split only when the N itself is shared between beads', async () => {
    const quat = await parseMolecule({ smiles: 'C[N+](C)(C)CC' });
    expect(splitChecks(quat, [[0, 1, 2, 3], [4, 5]])).toEqual([]);
    const shared = { beads: [
      { id: 'a', name: 'A', centre: 'mass' as const, atoms: [{ index: 0, weight: 1 }, { index: 1, weight: 0.5 }, { index: 2, weight: 1 }, { index: 3, weight: 1 }] },
      { id: 'b', name: 'B', centre: 'mass' as const, atoms: [{ index: 1, weight: 0.5 }, { index: 4, weight: 1 }, { index: 5, weight: 1 }] },
    ] };
    const checks = evaluateMapping(quat, shared, { fragments: false }).checks.filter((c) => c.code === 'split_charged_group');
    expect(checks.map((c) => c.beads)).toEqual([['a', 'b']]);
  });
});

describe('charged species (molecule-level logP warning)', () => {
  it('ions, salts and zwitterions are charged species; nitro compounds and N-oxides are not', async () => {
    const charged = async (smiles: string) => {
      const m = await parseMolecule({ smiles });
      return isChargedSpecies(m, prepare(m));
    };
    expect(await charged('CCCCCCCCCCCCOS(=O)(=O)[O-]')).toBe(true);
    expect(await charged('[NH4+]')).toBe(true);
    expect(await charged('[NH3+]CC(=O)[O-]')).toBe(true); // glycine zwitterion
    expect(await charged('CCCCCCCCCCCCOS(=O)(=O)[O-].[Na+]')).toBe(true);
    expect(await charged('c1ccccc1[N+](=O)[O-]')).toBe(false);
    expect(await charged('C[N+](C)(C)[O-]')).toBe(false);
    expect(await charged('CCO')).toBe(false);
  });
});
