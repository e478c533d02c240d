/**
 * Unit conversion for the LAMMPS export, worked by hand from defined constants, then checked by LAMMPS
 * (LMP_PATH from `npm test`) itself: the energy of a stretched harmonic bond as LAMMPS computes it from
 * our data file equals GROMACS' E = ½k(r − r0)² converted to kcal/mol.
 * Constants: 1 kcal (thermochemical) = 4.184 J exactly (NIST SP 811, 2008, B.8); 1 nm = 10 Å.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { angleK, bondK, kcal, lammpsFiles } from '../../../server/exports/lammps';
import type { CgModel } from '../../../server/exports/cg-model';

const dir = mkdtempSync(join(tmpdir(), 'beadloom-lmp-units-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('kJ mol⁻¹ nm⁻² → kcal mol⁻¹ Å⁻²', () => {
  it('1 kJ mol⁻¹ nm⁻² = 1/(4.184 × 100) kcal mol⁻¹ Å⁻² = 0.002390057… (worked by hand)', () => {
    // 1 kJ/mol/nm² = (1/4.184 kcal/mol) / (10 Å)² = 1/418.4 = 0.00239005736…
    expect(kcal(1) / 100).toBeCloseTo(0.00239005736, 11);
    // LAMMPS' K has no ½: a GROMACS kb = 1000 kJ/mol/nm² is K = 500/418.4 = 1.19502868… kcal/mol/Å².
    expect(bondK(1000)).toBeCloseTo(1.19502868, 8);
    // Angles keep radians: k = 100 kJ/mol/rad² → K = 50/4.184 = 11.9502868… kcal/mol/rad².
    expect(angleK(100)).toBeCloseTo(11.9502868, 6);
  });

  it('LAMMPS computes the stretched bond’s energy that GROMACS’ ½k(r − r0)² gives', () => {
    const k = 5000; // kJ/mol/nm²
    const r0 = 0.47; // nm
    const stretch = 0.02; // nm
    const model: CgModel = {
      types: [
        {
          name: 'PAIR',
          residue: 'PAIR',
          nrexcl: 1,
          exclusions: [],
          beads: [
            { name: 'A', residue: 1, type: 'T', mass: 72, charge: 0, xyz: [1, 1, 1] },
            { name: 'B', residue: 1, type: 'T', mass: 72, charge: 0, xyz: [1 + r0 + stretch, 1, 1] },
          ],
          terms: [{ kind: 'bond', beads: [0, 1], params: { function: 'harmonic', value: r0, k } }],
        },
      ],
    };
    const { data } = lammpsFiles(model, [{ engineName: 'T', beadType: 'T', sigma: 0.5, epsilon: 2, placeholder: true }], ['test'], 'pair.data');
    writeFileSync(join(dir, 'pair.data'), data);
    writeFileSync(join(dir, 'in.zero'), ['units real', 'atom_style full', 'bond_style harmonic', 'pair_style lj/cut 12.0', 'read_data pair.data', 'special_bonds lj/coul 0.0 1.0 1.0', 'thermo_style custom step ebond', 'run 0', ''].join('\n'));
    const run = spawnSync(process.env.LMP_PATH ?? '/usr/bin/lmp', ['-in', 'in.zero', '-log', 'log.zero', '-screen', 'none'], { cwd: dir, encoding: 'utf8' });
    const log = readFileSync(join(dir, 'log.zero'), 'utf8');
    expect(run.status, log.slice(-1500)).toBe(0);
    const row = log.split('\n')[log.split('\n').findIndex((l) => /^\s*Step\s+E_bond/.test(l)) + 1].trim().split(/\s+/);
    const gromacsKj = 0.5 * k * stretch * stretch; // 1.0 kJ/mol
    expect(gromacsKj).toBeCloseTo(1.0, 12);
    expect(Number(row[1])).toBeCloseTo(gromacsKj / 4.184, 5); // 0.239006 kcal/mol
  });
});
