/**
 * Attachment points (`*` of repeat units and end groups) and the components of salts.
 * Sources: CIAAW 2021 standard atomic weights (C 12.011, H 1.008, O 15.999, conventional values);
 * RDKit (@rdkit/rdkit) for Crippen logP, which reads `*` as a dummy atom with no contribution of its
 * own and types its neighbours with the dummy as a neighbour; size rules are common practice, no source.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { ChemError, evaluateMapping, loadRdkit, parseMolecule } from '../../../server/chem/index';
import type { RDKit } from '../../../server/chem/rdkit';
import { beadsFrom } from './helpers';
import { rdkitReference } from './rdkit-reference';
import { warmUpChemistry } from './warm-up';

warmUpChemistry();
let rd: RDKit;
beforeAll(async () => {
  rd = await loadRdkit();
});

describe('attachment points', () => {
  it('*CC(*)c1ccccc1 is C8H8 + 2 attachment points, 104.152 g/mol, neighbours keep their hydrogens', async () => {
    const m = await parseMolecule({ smiles: '*CC(*)c1ccccc1' });
    expect(m.formula).toBe('C8H8');
    expect(m.molecularWeight).toBeCloseTo(8 * 12.011 + 8 * 1.008, 10); // CIAAW 2021: 104.152
    expect(m.heavyAtoms).toBe(8);
    expect(m.repeatUnit).toBe(true);
    expect(m.attachmentPoints).toEqual([0, 3]);
    expect(m.atoms[0]).toMatchObject({ element: '*', attachment: true, hydrogens: 0, charge: 0 });
    expect(m.atoms[1]).toMatchObject({ element: 'C', hydrogens: 2 });
    expect(m.atoms[2]).toMatchObject({ element: 'C', hydrogens: 1 });
    expect(m.canonicalSmiles).not.toContain('Rf');
    // RDKit: the dummy atom has no Crippen type (contribution 0); the total is RDKit's.
    expect(m.atomLogP[0]).toBe(0);
    expect(m.logP).toBeCloseTo(rdkitReference(rd, '*CC(*)c1ccccc1').clogp, 6);
    expect(m.warnings).toEqual([]);
  });

  it.each([
    ['*OCC*', 'C2H4O', 2 * 12.011 + 4 * 1.008 + 15.999],
    ['*CC*', 'C2H4', 2 * 12.011 + 4 * 1.008],
    ['*c1ccc(*)cc1', 'C6H4', 6 * 12.011 + 4 * 1.008],
    ['[*]C(=O)CCCCC[*:2]', 'C6H10O', 6 * 12.011 + 10 * 1.008 + 15.999],
    ['*=CC=*', 'C2H2', 2 * 12.011 + 2 * 1.008],
    ['CCCC*', 'C4H9', 4 * 12.011 + 9 * 1.008],
  ])('%s: %s, hand-summed CIAAW mass, RDKit logP', async (smiles, formula, mass) => {
    const m = await parseMolecule({ smiles });
    expect(m.formula).toBe(formula);
    expect(m.molecularWeight).toBeCloseTo(mass, 9);
    expect(m.logP).toBeCloseTo(rdkitReference(rd, smiles).clogp, 6);
  });

  it('an attachment point is massless, not a heavy atom and never "unassigned"', async () => {
    const m = await parseMolecule({ smiles: '*CC(*)c1ccccc1' });
    const all = evaluateMapping(m, beadsFrom([[1, 2, 4, 5], [6, 7, 8, 9]]));
    expect(all.beads.map((b) => b.heavyAtoms)).toEqual([4, 4]);
    expect(all.checks.map((c) => c.code)).not.toContain('unassigned_atom');
    const withStar = evaluateMapping(m, beadsFrom([[0, 1, 2, 3, 4], [5, 6, 7, 8, 9]]));
    expect(withStar.beads[0].heavyAtoms).toBe(3);
    expect(withStar.beads[0].mass).toBeCloseTo(3 * 12.011 + 3 * 1.008, 9);
  });

  it('refuses an attachment point with hydrogens or a charge', async () => {
    await expect(parseMolecule({ smiles: '[*H]C' })).rejects.toBeInstanceOf(ChemError);
    await expect(parseMolecule({ smiles: '[*-]C' })).rejects.toBeInstanceOf(ChemError);
  });

  it('an ordinary molecule is no repeat unit', async () => {
    const m = await parseMolecule({ smiles: 'CCO' });
    expect([m.repeatUnit, m.attachmentPoints, m.heavyAtoms]).toEqual([false, [], 3]);
  });
});

describe('components and free ions', () => {
  it('lists the parts of sodium dodecyl sulfate; Na+ is a free ion', async () => {
    const m = await parseMolecule({ smiles: 'CCCCCCCCCCCCOS(=O)(=O)[O-].[Na+]' });
    expect(m.components).toHaveLength(2);
    expect(m.components![0]).toMatchObject({ formula: 'C12H25O4S -', charge: -1, freeIon: false });
    expect(m.components![1]).toMatchObject({ atoms: [17], formula: 'Na +', charge: 1, freeIon: true });
  });

  it('calcium chloride: three free ions; ammonium counts (one atom with its hydrogens)', async () => {
    const ca = await parseMolecule({ smiles: '[Ca+2].[Cl-].[Cl-]' });
    expect(ca.components!.map((c) => c.freeIon)).toEqual([true, true, true]);
    const nh4 = await parseMolecule({ smiles: 'CC(=O)[O-].[NH4+]' });
    expect(nh4.components!.map((c) => c.freeIon)).toEqual([false, true]);
    const water = await parseMolecule({ smiles: 'CCO.O' });
    expect(water.components!.map((c) => c.freeIon)).toEqual([false, false]);
  });

  it('a free ion in its own bead gets no size finding and no merge advice; a neutral one-atom bead still does', async () => {
    const m = await parseMolecule({ smiles: 'CCCCCCCCCCCCOS(=O)(=O)[O-].[Na+]' });
    const mapping = beadsFrom([[0, 1, 2, 3], [4, 5, 6, 7], [8, 9, 10, 11], [12, 13, 14, 15, 16], [17]]);
    const checks = evaluateMapping(m, mapping).checks;
    expect(checks.filter((c) => c.beads.includes('b4'))).toEqual([]);
    const alone = evaluateMapping(m, beadsFrom([[0, 1, 2, 3], [4, 5, 6, 7], [8, 9, 10, 11], [12, 13, 14, 15], [16], [17]])).checks;
    expect(alone.find((c) => c.code === 'bead_too_small')?.beads).toEqual(['b4']);
  });

  it('atom numbers in messages count from 1', async () => {
    const m = await parseMolecule({ smiles: 'CCO' });
    try {
      evaluateMapping(m, beadsFrom([[0, 7]]));
      throw new Error('expected a refusal');
    } catch (e) {
      expect((e as ChemError).message).toMatch(/lists atom 8 \(index 7\), but the molecule has atoms 1 to 3/);
    }
  });
});
