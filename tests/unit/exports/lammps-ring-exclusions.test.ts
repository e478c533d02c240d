/**
 * GROMACS' [ exclusions ] of a rigid ring in LAMMPS (server/exports/lammps.ts): a four-bead ring whose
 * bonds are all constraints has its two diagonal pairs joined by bonds of zero force constant, so that
 * with exclusion count 1 (special_bonds 0.0 1.0 1.0) LAMMPS excludes every pair of the ring, as GROMACS
 * does. Checked by LAMMPS itself (LMP_PATH from `npm test`): the molecule's Lennard-Jones energy is
 * exactly 0 with the zero bonds and not 0 without them (the diagonals are then 1-3 pairs, weight 1).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { lammpsFiles } from '../../../server/exports/lammps';
import type { CgModel } from '../../../server/exports/cg-model';

const dir = mkdtempSync(join(tmpdir(), 'beadloom-lmp-ring-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const side = 0.3; // nm: a square ring; its diagonal (0.424 nm) lies inside the 0.5 nm placeholder sigma
const ring = (exclusions: [number, number][]): CgModel => ({
  types: [
    {
      name: 'RING',
      residue: 'RING',
      nrexcl: 1,
      exclusions,
      beads: [[0, 0], [side, 0], [side, side], [0, side]].map(([x, y], i) => ({ name: `R${i + 1}`, residue: 1, type: 'T', mass: 72, charge: 0, xyz: [2 + x, 2 + y, 2] as [number, number, number] })),
      terms: [[0, 1], [1, 2], [2, 3], [3, 0]].map((beads) => ({ kind: 'bond' as const, beads, params: { function: 'harmonic' as const, value: side, k: null, constraint: true } })),
    },
  ],
});
const all: [number, number][] = [[0, 1], [0, 2], [0, 3], [1, 2], [1, 3], [2, 3]];

function evdwl(model: CgModel, name: string): { energy: number; data: string; input: string } {
  const { data, input } = lammpsFiles(model, [{ engineName: 'T', beadType: 'T', sigma: 0.5, epsilon: 2, placeholder: true }], ['test', 'ring'], `${name}.data`);
  writeFileSync(join(dir, `${name}.data`), data);
  // The exported input's styles and special_bonds, then one energy evaluation.
  const head = input.split('\n').filter((l) => /^(units|atom_style|boundary|pair_style|bond_style|read_data|special_bonds)\b/.test(l));
  writeFileSync(join(dir, `in.${name}`), [...head, 'thermo_style custom step evdwl', 'run 0', ''].join('\n'));
  const run = spawnSync(process.env.LMP_PATH ?? '/usr/bin/lmp', ['-in', `in.${name}`, '-log', `log.${name}`, '-screen', 'none'], { cwd: dir, encoding: 'utf8' });
  const log = readFileSync(join(dir, `log.${name}`), 'utf8');
  expect(run.status, log.slice(-1500)).toBe(0);
  const lines = log.split('\n');
  return { energy: Number(lines[lines.findIndex((l) => /^\s*Step\s+E_vdwl/.test(l)) + 1].trim().split(/\s+/)[1]), data, input };
}

describe('rigid-ring exclusions in LAMMPS', () => {
  it('joins the unbonded ring pairs by zero-force-constant bonds, so LAMMPS excludes the whole ring', () => {
    const excluded = evdwl(ring(all), 'rigid');
    expect(excluded.data).toMatch(/^\d+ 0\.0 4\.24264\d* {2}# exclusion only: rigid-ring pair R1-R3$/m);
    expect(excluded.data).toContain('6 bonds');
    expect(excluded.input).toContain('Rigid-ring pairs 1-3, 2-4 are joined by bonds of zero force constant');
    expect(excluded.energy).toBe(0);
    const plain = evdwl(ring([]), 'plain');
    expect(plain.data).toContain('4 bonds');
    expect(Math.abs(plain.energy)).toBeGreaterThan(0.1);
  });
});
