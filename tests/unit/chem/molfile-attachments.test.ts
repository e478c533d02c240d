/**
 * Attachment points in uploaded molfiles: `*`, `R` and `R#` atoms (V2000 and V3000; BIOVIA "CTfile
 * Formats") become attachment points exactly as `*` in a SMILES does. The molfiles below are written by
 * hand. Expected formulas and masses are worked by hand with CIAAW 2021 standard atomic weights
 * (conventional values: C 12.011, H 1.008, O 15.999); logP is RDKit's CrippenClogP of the same unit
 * written as a SMILES with `*` (RDKit reads `*` as a dummy atom with no contribution of its own).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { ChemError, loadRdkit, parseMolecule } from '../../../server/chem/index';
import type { RDKit } from '../../../server/chem/rdkit';
import { rdkitReference } from './rdkit-reference';
import { warmUpChemistry } from './warm-up';

warmUpChemistry();
let rd: RDKit;
beforeAll(async () => {
  rd = await loadRdkit();
});

// Polystyrene repeat unit *–CH2–CH(*)–C6H5, Kekulé ring, 2D.
const POLYSTYRENE_V2000 = `polystyrene unit
  handwritten

 10 10  0  0  0  0  0  0  0  0999 V2000
   -1.2990    0.7500    0.0000 *   0  0  0  0  0  0  0  0  0  0  0  0
    0.0000    0.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0
    1.2990    0.7500    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0
    1.2990    2.2500    0.0000 *   0  0  0  0  0  0  0  0  0  0  0  0
    2.5981    0.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0
    3.8971    0.7500    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0
    5.1962    0.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0
    5.1962   -1.5000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0
    3.8971   -2.2500    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0
    2.5981   -1.5000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0
  1  2  1  0
  2  3  1  0
  3  4  1  0
  3  5  1  0
  5  6  2  0
  6  7  1  0
  7  8  2  0
  8  9  1  0
  9 10  2  0
 10  5  1  0
M  END
`;

// Poly(ethylene oxide) unit R#–CH2–CH2–O–R#, with its R-group line.
const PEG_RGROUP_V2000 = `PEG unit
  handwritten

  5  4  0  0  0  0  0  0  0  0999 V2000
   -1.2990    0.7500    0.0000 R#  0  0  0  0  0  0  0  0  0  0  0  0
    0.0000    0.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0
    1.2990    0.7500    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0
    2.5981    0.0000    0.0000 O   0  0  0  0  0  0  0  0  0  0  0  0
    3.8971    0.7500    0.0000 R#  0  0  0  0  0  0  0  0  0  0  0  0
  1  2  1  0
  2  3  1  0
  3  4  1  0
  4  5  1  0
M  RGP  2   1   1   5   2
M  END
`;

// A carboxylic acid end group R–C(=O)–OH with a plain R.
const CARBOXYL_R_V2000 = `carboxyl end group
  handwritten

  4  3  0  0  0  0  0  0  0  0999 V2000
    0.0000    0.0000    0.0000 R   0  0  0  0  0  0  0  0  0  0  0  0
    1.2990    0.7500    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0
    1.2990    2.2500    0.0000 O   0  0  0  0  0  0  0  0  0  0  0  0
    2.5981    0.0000    0.0000 O   0  0  0  0  0  0  0  0  0  0  0  0
  1  2  1  0
  2  3  2  0
  2  4  1  0
M  END
`;

// Polyethylene unit *–CH2–CH2–R# in V3000, the R# with RGROUPS.
const ETHYLENE_V3000 = `ethylene unit
  handwritten

  0  0  0     0  0            999 V3000
M  V30 BEGIN CTAB
M  V30 COUNTS 4 3 0 0 0
M  V30 BEGIN ATOM
M  V30 1 * -1.299 0.75 0 0
M  V30 2 C 0 0 0 0
M  V30 3 C 1.299 0.75 0 0
M  V30 4 R# 2.598 0 0 0 RGROUPS=(1 1)
M  V30 END ATOM
M  V30 BEGIN BOND
M  V30 1 1 1 2
M  V30 2 1 2 3
M  V30 3 1 3 4
M  V30 END BOND
M  V30 END CTAB
M  END
`;

async function refusal(molfile: string): Promise<ChemError> {
  try {
    await parseMolecule({ molfile });
  } catch (e) {
    expect(e).toBeInstanceOf(ChemError);
    return e as ChemError;
  }
  throw new Error('expected a ChemError');
}

describe('attachment points in molfiles', () => {
  it('V2000 with *: the polystyrene unit is C8H8 + 2 attachment points, 104.152 g/mol, as from its SMILES', async () => {
    const m = await parseMolecule({ molfile: POLYSTYRENE_V2000 });
    expect(m.formula).toBe('C8H8');
    expect(m.molecularWeight).toBeCloseTo(8 * 12.011 + 8 * 1.008, 10); // CIAAW 2021 by hand: 104.152
    expect(m.heavyAtoms).toBe(8);
    expect(m.repeatUnit).toBe(true);
    expect(m.attachmentPoints).toEqual([0, 3]);
    expect(m.atoms[0]).toMatchObject({ element: '*', attachment: true, hydrogens: 0, charge: 0 });
    // The neighbours keep their hydrogens: CH2 and CH.
    expect(m.atoms[1]).toMatchObject({ element: 'C', hydrogens: 2 });
    expect(m.atoms[2]).toMatchObject({ element: 'C', hydrogens: 1 });
    expect(m.atomLogP[0]).toBe(0);
    expect(m.logP).toBeCloseTo(rdkitReference(rd, '*CC(*)c1ccccc1').clogp, 6);
    // The drawing is the file's own (a 2D molfile keeps its coordinates).
    expect(m.atoms[3]).toMatchObject({ x: 1.299, y: 2.25 }); // y up, as in the file
  });

  it('V2000 with R# and M  RGP: the PEG unit is C2H4O, 44.053 g/mol', async () => {
    const m = await parseMolecule({ molfile: PEG_RGROUP_V2000 });
    expect(m.formula).toBe('C2H4O');
    expect(m.molecularWeight).toBeCloseTo(2 * 12.011 + 4 * 1.008 + 15.999, 10); // 44.053
    expect(m.heavyAtoms).toBe(3);
    expect(m.attachmentPoints).toEqual([0, 4]);
    expect(m.atoms.map((a) => a.hydrogens)).toEqual([0, 2, 2, 0, 0]);
    expect(m.logP).toBeCloseTo(rdkitReference(rd, '*CCO*').clogp, 6);
  });

  it('V2000 with a plain R: the carboxyl end group is CHO2, 45.017 g/mol, its OH kept', async () => {
    const m = await parseMolecule({ molfile: CARBOXYL_R_V2000 });
    expect(m.formula).toBe('CHO2');
    expect(m.molecularWeight).toBeCloseTo(12.011 + 1.008 + 2 * 15.999, 10); // 45.017
    expect(m.heavyAtoms).toBe(3);
    expect(m.repeatUnit).toBe(true);
    expect(m.atoms.map((a) => [a.element, a.hydrogens])).toEqual([['*', 0], ['C', 0], ['O', 0], ['O', 1]]);
  });

  it('V3000 with * and R# (RGROUPS): the ethylene unit is C2H4, 28.054 g/mol', async () => {
    const m = await parseMolecule({ molfile: ETHYLENE_V3000 });
    expect(m.formula).toBe('C2H4');
    expect(m.molecularWeight).toBeCloseTo(2 * 12.011 + 4 * 1.008, 10); // 28.054
    expect(m.heavyAtoms).toBe(2);
    expect(m.attachmentPoints).toEqual([0, 3]);
    expect(m.atoms.map((a) => a.hydrogens)).toEqual([0, 2, 2, 0]);
    expect(m.logP).toBeCloseTo(rdkitReference(rd, '*CC*').clogp, 6);
  });

  it('refuses a real rutherfordium atom (no standard atomic weight; the placeholder stays unambiguous)', async () => {
    const e = await refusal(CARBOXYL_R_V2000.replace(' R   0', ' Rf  0'));
    expect(e.code).toBe('unsupported_atom');
    expect(e.details).toEqual({ atom: 1 });
  });

  it.each([
    ['A (any atom)', CARBOXYL_R_V2000.replace(' R   0', ' A   0')],
    ['Q (any hetero atom)', CARBOXYL_R_V2000.replace(' R   0', ' Q   0')],
    ['a V3000 atom list', ETHYLENE_V3000.replace('M  V30 2 C ', 'M  V30 2 [C,N] ')],
  ])('refuses query atoms: %s', async (_, molfile) => {
    const e = await refusal(molfile);
    expect(e.code).toBe('query_not_supported');
  });

  it('refuses a query bond type ("any" bond, type 8)', async () => {
    const e = await refusal(CARBOXYL_R_V2000.replace('  2  4  1  0', '  2  4  8  0'));
    expect(e.code).toBe('query_not_supported');
  });
});
