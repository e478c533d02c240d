/**
 * SMILES input at the edges: strings that are not complete SMILES, characters that are not SMILES,
 * query features, CXSMILES, hydrogen-only species and aromatic systems openchemlib cannot kekulize.
 * Outside references: RDKit (@rdkit/rdkit MinimalLib) for logP and weight of what is read; the
 * OpenSMILES specification (opensmiles.org, sections 3.1–3.6) for what a complete SMILES is.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { ChemError, loadRdkit, parseMolecule } from '../../../server/chem/index';
import type { RDKit } from '../../../server/chem/rdkit';
import { createMoleculeBody } from '../../../src/shared/molecules';
import { moleculeBodySchema } from '../../../src/shared/mapping-schema';
import { rdkitReference } from './rdkit-reference';
import { warmUpChemistry } from './warm-up';

warmUpChemistry();
let rd: RDKit;
beforeAll(async () => {
  rd = await loadRdkit();
});

async function refusal(smiles: string): Promise<ChemError> {
  try {
    await parseMolecule({ smiles });
  } catch (e) {
    expect(e).toBeInstanceOf(ChemError);
    return e as ChemError;
  }
  throw new Error(`expected ${JSON.stringify(smiles)} to be refused`);
}

const rdkit = (smiles: string) => rdkitReference(rd, smiles);

describe('a SMILES is read whole or not at all', () => {
  // openchemlib alone read each of these as a smaller molecule (propane, butanol, ethanol, benzene).
  it.each([
    ['CC(C', 'incomplete_smiles', 3],
    ['OCC(CC', 'incomplete_smiles', 4],
    ['C1CC', 'incomplete_smiles', 2],
    ['C1CC1C2CC', 'incomplete_smiles', 7],
    ['CC=', 'incomplete_smiles', 3],
    ['[NH4+', 'incomplete_smiles', 1],
    ['CC)C', 'unparseable_smiles', 3],
    ['C()C', 'unparseable_smiles', 3],
    ['.CC', 'unparseable_smiles', 1],
    ['C11', 'unparseable_smiles', 3],
    ['CXC', 'unparseable_smiles', 2],
    ['[Xx]C', 'unparseable_smiles', 1],
  ])('%s → %s at character %i', async (smiles, code, position) => {
    const e = await refusal(smiles);
    expect([e.code, e.status, e.details.position]).toEqual([code, 422, position]);
    expect(e.message).toContain(`character ${position}`);
    expect(rd.get_mol(smiles), 'RDKit refuses it too').toBeNull();
  });

  it.each([
    ['CCO\u0000CCCC', 4, /control character \(U\+0000\)/],
    ['éc1ccccc1', 1, /"é" \(U\+00E9, not ASCII\)/],
    ['CC\u{1F600}O', 3, /U\+1F600/],
    ['CC\tO', 3, /control character/],
    ['C\u00A0C', 2, /not ASCII/],
  ])('refuses %j with the position of the bad character', async (smiles, position, message) => {
    const e = await refusal(smiles);
    expect([e.code, e.details.position]).toEqual(['unparseable_smiles', position]);
    expect(e.message).toMatch(message);
    // The shared schema (the form and the routes) names the same character.
    for (const parsed of [createMoleculeBody.safeParse({ name: 'x', smiles }), moleculeBodySchema.safeParse({ smiles })]) {
      expect(parsed.success).toBe(false);
      expect(JSON.stringify(parsed.error!.issues)).toContain(`Character ${position} is`);
    }
  });

  it('the schema lets a good SMILES through unchanged (trimmed)', () => {
    const parsed = createMoleculeBody.parse({ name: 'x', smiles: '  CC(=O)[O-].[Na+] ' });
    expect(parsed.smiles).toBe('CC(=O)[O-].[Na+]');
  });

  it.each(['[#6]CC', 'C~C', '[C;H2]C', 'C!C', '[C,N]C', '[R]C', 'C@C'])('refuses the query feature in %s', async (smiles) => {
    const e = await refusal(smiles);
    expect(e.code).toBe('query_not_supported');
    expect(e.message).toMatch(/query/);
  });

  it('refuses CXSMILES extensions clearly, naming where they start', async () => {
    const e = await refusal('CC |$;R1$|');
    expect([e.code, e.details.position]).toEqual(['cxsmiles_not_supported', 3]);
    expect(e.message).toMatch(/CXSMILES/);
    expect((await refusal('CC O')).code).toBe('unparseable_smiles');
  });

  it('still reads ring bonds after a branch and across a dot, as RDKit does', async () => {
    expect((await parseMolecule({ smiles: 'C(C)1CC1' })).formula).toBe('C4H8');
    expect((await parseMolecule({ smiles: 'C1.C1' })).formula).toBe('C2H6');
    expect((await parseMolecule({ smiles: 'C%10CC%10' })).formula).toBe('C3H6');
  });
});

describe('hydrogen-only species', () => {
  // RDKit gives the bare hydrogen type HS (0.1125) and H bonded to H type H1 (0.123 each); Wildman &
  // Crippen 1999, Table 1.
  it.each(['[H][H]', '[2H][2H]', '[H+]', '[H-]', '[H]', '[2H+]'])('%s is read with RDKit’s logP and weight', async (smiles) => {
    const m = await parseMolecule({ smiles });
    const ref = rdkit(smiles);
    expect(m.logP).toBeCloseTo(ref.clogp, 6);
    expect(m.molecularWeight).toBeCloseTo(ref.amw, 3);
    expect(m.heavyAtoms).toBe(0);
  });

  it('the bare H atom: logP 0.1125 (RDKit), 1.008 g/mol (CIAAW 2021)', async () => {
    const m = await parseMolecule({ smiles: '[H]' });
    expect(m.logP).toBeCloseTo(0.1125, 10);
    expect(m.molecularWeight).toBe(1.008);
    expect(m.formula).toBe('H');
  });

  it('a hydrogen bonded to two atoms is a 422 naming it, not an internal error', async () => {
    const e = await refusal('C[H-]C');
    expect([e.code, e.status, e.details.atom]).toEqual(['bridging_hydrogen', 422, 2]);
  });
});

describe('aromatic systems openchemlib cannot kekulize are kekulized by RDKit', () => {
  const macrocycles = [
    ['porphine', 'c1cc2cc3ccc(cc4ccc(cc5ccc(cc1n2)[nH]5)n4)[nH]3'],
    ['tetraphenylporphyrin', 'c1ccc(cc1)-c1c2ccc(n2)c(-c2ccccc2)c2ccc([nH]2)c(-c2ccccc2)c2ccc(n2)c(-c2ccccc2)c2ccc1[nH]2'],
    ['chlorin', 'C1Cc2cc3ccc(cc4ccc(cc5ccc(cc1n2)[nH]5)n4)[nH]3'],
    ['corrole', 'c1cc2cc3ccc([nH]3)c3ccc(cc4ccc(cc1[nH]2)n4)[nH]3'],
    ['tellurophene', 'c1cc[te]c1'],
    ['benzotellurophene', 'c1ccc2[te]ccc2c1'],
  ];
  it.each(macrocycles)('%s: RDKit’s logP and weight', async (_name, smiles) => {
    const m = await parseMolecule({ smiles });
    const ref = rdkit(smiles);
    expect(Math.abs(m.logP - ref.clogp)).toBeLessThan(0.01);
    expect(Math.abs(m.molecularWeight - ref.amw)).toBeLessThan(0.02); // RDKit's Te weight is CIAAW's
    expect(m.warnings.join(' ')).toMatch(/RDKit assigned its alternating bonds/);
  });

  it('a ring neither can kekulize gets a hint about the real cause', async () => {
    const e = await refusal('n1cccc1');
    expect(e.code).toBe('kekulization_failed');
    expect(e.message).toMatch(/neither openchemlib nor RDKit/);
  });
});
