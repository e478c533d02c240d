import { describe, expect, it } from 'vitest';
import { warmUpChemistry } from './warm-up';
import { ChemError, LIMITS, parseMolecule } from '../../../server/chem/index';


warmUpChemistry();
async function chemError(p: Promise<unknown>): Promise<ChemError> {
  try {
    await p;
  } catch (e) {
    expect(e).toBeInstanceOf(ChemError);
    return e as ChemError;
  }
  throw new Error('expected a ChemError');
}

const molfile = (atoms: string[], bonds: string[], counts = `${String(atoms.length).padStart(3)}${String(bonds.length).padStart(3)}`): string =>
  ['water', '  Beadloom0101250000' + '3D', '', `${counts}  0  0  0  0  0  0  0  0999 V2000`, ...atoms, ...bonds, 'M  END', ''].join('\n');
const atomLine = (x: number, y: number, z: number, el: string): string =>
  `${x.toFixed(4).padStart(10)}${y.toFixed(4).padStart(10)}${z.toFixed(4).padStart(10)} ${el.padEnd(3)} 0  0  0  0  0  0  0  0  0  0  0  0`;
const bondLine = (a: number, b: number, o = 1): string => `${String(a).padStart(3)}${String(b).padStart(3)}${String(o).padStart(3)}  0`;

describe('atom-index contract', () => {
  it('lists heavy atoms only, each with its hydrogens', async () => {
    const m = await parseMolecule({ smiles: 'OCC' });
    expect(m.atoms.map((a) => a.element)).toEqual(['O', 'C', 'C']);
    expect(m.atoms.map((a) => a.hydrogens)).toEqual([1, 2, 3]);
    expect(m.bonds.map((b) => [b.a, b.b])).toEqual([[0, 1], [1, 2]]);
    expect(m.atoms.every((a, i) => a.index === i)).toBe(true);
  });

  it('folds explicit [H] into the heavy atoms (the model order is the contract, not the string)', async () => {
    const m = await parseMolecule({ smiles: '[H]OC([H])([H])C' });
    expect(m.atoms).toHaveLength(3);
    expect(m.atoms.some((a) => a.element === 'H')).toBe(false);
    expect(m.atoms.reduce((s, a) => s + a.hydrogens, 0)).toBe(6);
    expect(m.formula).toBe('C2H6O');
  });

  it('keeps isotope labels and their masses', async () => {
    const d = await parseMolecule({ smiles: '[2H]C([2H])([2H])O' });
    expect(d.atoms.map((a) => a.element)).toEqual(['C', 'O']);
    expect(d.atoms[0].hydrogenIsotopes).toEqual([2, 2, 2]);
    expect(d.formula).toBe('CHD3O');
    // Hand sum: 12.011 + 3 × 2.01410177812 + 15.999 + 1.008 (CIAAW 2021, AME2020).
    expect(d.molecularWeight).toBeCloseTo(12.011 + 3 * 2.01410177812 + 15.999 + 1.008, 9);
    const c13 = await parseMolecule({ smiles: 'C[13CH2]O' });
    expect(c13.atoms[1].isotope).toBe(13);
    expect(c13.formula).toBe('C[13C]H6O');
  });

  it('gives 2D drawing coordinates from the same parse', async () => {
    const m = await parseMolecule({ smiles: 'c1ccccc1CCO' });
    expect(m.atoms.every((a) => Number.isFinite(a.x) && Number.isFinite(a.y))).toBe(true);
    expect(new Set(m.atoms.map((a) => `${a.x},${a.y}`)).size).toBe(m.atoms.length);
  });

  it('reads a 3D molfile with every hydrogen and keeps its coordinates in contract order', async () => {
    const text = molfile([atomLine(0, 0, 0, 'O'), atomLine(0.96, 0, 0, 'H'), atomLine(-0.24, 0.93, 0, 'H')], [bondLine(1, 2), bondLine(1, 3)]);
    const m = await parseMolecule({ molfile: text });
    expect(m.atoms).toHaveLength(1);
    expect(m.atoms[0].hydrogens).toBe(2);
    expect(m.coordinates).toEqual([[0, 0, 0], [0.96, 0, 0], [-0.24, 0.93, 0]]);
  });

  it('reads V3000 and takes the first record of an SD file', async () => {
    const v3 = ['', '  test', '', '  0  0  0     0  0            999 V3000', 'M  V30 BEGIN CTAB', 'M  V30 COUNTS 2 1 0 0 0',
      'M  V30 BEGIN ATOM', 'M  V30 1 C 0 0 0 0', 'M  V30 2 O 1.4 0 0 0', 'M  V30 END ATOM', 'M  V30 BEGIN BOND', 'M  V30 1 1 1 2',
      'M  V30 END BOND', 'M  V30 END CTAB', 'M  END', '$$$$', ''].join('\n');
    const m = await parseMolecule({ molfile: v3 + v3 });
    expect(m.formula).toBe('CH4O');
    expect(m.warnings.join(' ')).toMatch(/first/);
  });

  it('round-trips through its canonical SMILES', async () => {
    for (const s of ['CC(=O)Oc1ccccc1C(=O)O', 'C[N+](C)(C)CC(=O)[O-]', 'OC[C@H]1OC(O)[C@H](O)[C@@H](O)[C@@H]1O']) {
      const m = await parseMolecule({ smiles: s });
      const again = await parseMolecule({ smiles: m.canonicalSmiles });
      expect(again.formula).toBe(m.formula);
      expect(again.logP).toBeCloseTo(m.logP, 10);
    }
  });

  it('shows a net charge after the Hill formula', async () => {
    expect((await parseMolecule({ smiles: 'CC(=O)[O-]' })).formula).toBe('C2H3O2 -');
    expect((await parseMolecule({ smiles: '[O-]S(=O)(=O)[O-]' })).formula).toBe('O4S 2-');
    expect((await parseMolecule({ smiles: 'CC(=O)[O-].[Na+]' })).formula).toBe('C2H3NaO2');
  });
});

describe('molecular weights against a handbook', () => {
  // Source: CRC Handbook of Chemistry and Physics, physical constants of organic/inorganic compounds
  // (values to two decimals, from memory of the handbook tables). Chlorine compounds are left out on
  // purpose: handbook weights use the older Cl = 35.453, CIAAW 2021 gives 35.45 (0.003 per Cl).
  const handbook: [string, string, number][] = [
    ['benzene', 'c1ccccc1', 78.11],
    ['caffeine', 'Cn1cnc2c1c(=O)n(C)c(=O)n2C', 194.19],
    ['ethanol', 'CCO', 46.07],
    ['water', 'O', 18.02],
    ['glucose', 'OC[C@H]1OC(O)[C@H](O)[C@@H](O)[C@@H]1O', 180.16],
    ['aspirin', 'CC(=O)Oc1ccccc1C(=O)O', 180.16],
    ['sodium chloride', '[Na+].[Cl-]', 58.44],
    ['acetic acid', 'CC(=O)O', 60.05],
    ['urea', 'NC(N)=O', 60.06],
    ['dimethyl sulfoxide', 'CS(C)=O', 78.13],
    ['sodium dodecyl sulfate', 'CCCCCCCCCCCCOS(=O)(=O)[O-].[Na+]', 288.38],
    ['toluene', 'Cc1ccccc1', 92.14],
    ['naphthalene', 'c1ccc2ccccc2c1', 128.17],
    ['phenol', 'Oc1ccccc1', 94.11],
    ['sucrose', 'OC[C@H]1O[C@@](CO)(O[C@H]2O[C@H](CO)[C@@H](O)[C@H](O)[C@H]2O)[C@@H](O)[C@@H]1O', 342.3],
  ];
  it.each(handbook)('%s', async (_name, smiles, mw) => {
    const m = await parseMolecule({ smiles });
    expect(Math.abs(m.molecularWeight - mw)).toBeLessThan(0.01);
  });
});

describe('bad input', () => {
  it('refuses empty input', async () => {
    expect((await chemError(parseMolecule({ smiles: '  ' }))).code).toBe('empty_input');
    expect((await chemError(parseMolecule({ molfile: '' }))).code).toBe('empty_input');
  });

  it('reports where a SMILES cannot be read', async () => {
    // Positions count characters from 1: the unclosed ring bond "1" is character 2.
    const e = await chemError(parseMolecule({ smiles: 'C1CC' }));
    expect(e.code).toBe('incomplete_smiles');
    expect(e.status).toBe(422);
    expect(e.details.position).toBe(2);
    expect(e.message).toMatch(/ring bond "1" opened here is never closed/);
    expect((await chemError(parseMolecule({ smiles: 'CXxC' }))).code).toBe('unparseable_smiles');
  });

  it('refuses over-full valences and unkekulizable rings', async () => {
    const e = await chemError(parseMolecule({ smiles: 'C(C)(C)(C)(C)C' }));
    expect(e.code).toBe('valence_error');
    expect(e.details.atom).toBe(1); // atom numbers in messages and details count from 1
    expect(e.message).toMatch(/^Atom 1 \(C\)/);
    expect((await chemError(parseMolecule({ smiles: 'CN(C)(C)(C)C' }))).code).toBe('valence_error');
    expect((await chemError(parseMolecule({ smiles: 'n1cccc1' }))).code).toBe('kekulization_failed');
  });

  it('states the size limits (413)', async () => {
    const long = await chemError(parseMolecule({ smiles: 'C'.repeat(LIMITS.smilesLength + 1) }));
    expect([long.code, long.status]).toEqual(['smiles_too_long', 413]);
    expect(long.message).toContain(String(LIMITS.smilesLength));
    const n = LIMITS.heavyAtoms + 1;
    const atoms = Array.from({ length: n }, (_, i) => `M  V30 ${i + 1} C ${i * 1.5} 0 0 0`);
    const bonds = Array.from({ length: n - 1 }, (_, i) => `M  V30 ${i + 1} 1 ${i + 1} ${i + 2}`);
    const big = ['', '  big', '', '  0  0  0     0  0            999 V3000', 'M  V30 BEGIN CTAB', `M  V30 COUNTS ${n} ${n - 1} 0 0 0`,
      'M  V30 BEGIN ATOM', ...atoms, 'M  V30 END ATOM', 'M  V30 BEGIN BOND', ...bonds, 'M  V30 END BOND', 'M  V30 END CTAB', 'M  END'].join('\n');
    const tooMany = await chemError(parseMolecule({ molfile: big }));
    expect([tooMany.code, tooMany.status, tooMany.details.limit]).toEqual(['too_many_atoms', 413, LIMITS.heavyAtoms]);
  });

  it('refuses a molfile whose counts line does not match its blocks', async () => {
    const atoms = [atomLine(0, 0, 0, 'C'), atomLine(1.5, 0, 0, 'O')];
    expect((await chemError(parseMolecule({ molfile: molfile(atoms, [bondLine(1, 2)], '  3  1') }))).code).toBe('bad_counts_line');
    expect((await chemError(parseMolecule({ molfile: molfile(atoms, [bondLine(1, 2)], '  1  1') }))).code).toBe('bad_counts_line');
    expect((await chemError(parseMolecule({ molfile: 'not a molfile' }))).code).toBe('unparseable_molfile');
  });

  it('names an element missing from the mass table instead of returning NaN', async () => {
    const e = await chemError(parseMolecule({ smiles: '[Pu]' }));
    expect(e.code).toBe('element_not_in_mass_table');
    expect(e.message).toContain('Pu');
  });
});
