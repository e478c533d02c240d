import { mkdtempSync, rmSync, writeFileSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { generateConformer, parseMolecule, type Molecule } from '../../../server/chem/index';
import { matchReference } from '../../../server/references/match-reference';
import { MatchError } from '../../../server/references/match-errors';
import { groText, makeSystem, type RefSystem } from '../../../seeds/invented-reference';

// Finding every copy of a molecule in a reference, on invented systems (reference-systems.ts).

let dir: string;
let mol: Molecule;
let sys: RefSystem;

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'beadloom-match-'));
  // An invented ring-containing, drug-like molecule.
  mol = await parseMolecule({ smiles: 'Cc1ccc(cc1)C(=O)NCCO' });
  const xyz = await generateConformer(mol, { seed: 7 });
  sys = makeSystem(mol, xyz, { copies: 20, frames: 3, boxA: 54, noiseA: 0.05, seed: 11, residue: 'DRG', solvent: 30 });
  writeFileSync(join(dir, 'sys.gro'), groText(sys));
}, 60_000);

afterAll(() => rmSync(dir, { recursive: true, force: true }));

const task = (over: Partial<Parameters<typeof matchReference>[0]> = {}) => ({
  structure: { path: join(dir, 'sys.gro'), format: 'gro' as const },
  trajectory: null,
  selection: null,
  molecule: mol,
  outDir: dir,
  ...over,
});

describe('matching a reference', () => {
  it('finds all 20 copies, skips the solvent, and maps each atom to the contract order', async () => {
    const r = await matchReference(task(), () => {});
    expect(r).toMatchObject({ copies: 20, frames: 3, atomsPerCopy: sys.atomsPerCopy, atomsTotal: sys.elements.length });
    const bytes = readFileSync(join(dir, 'copies.bin'));
    const copies = new Int32Array(bytes.buffer, bytes.byteOffset, bytes.length / 4);
    // Heavy atoms must land exactly where the generator put them (hydrogens of one atom may swap).
    for (let c = 0; c < 20; c++) {
      for (let p = 0; p < mol.atoms.length; p++) {
        const symmetric = new Set([2, 3, 5, 6]); // the ring's mirror pairs (2↔6, 3↔5) may swap
        if (symmetric.has(p)) continue;
        expect(copies[c * sys.atomsPerCopy + p]).toBe(c * sys.atomsPerCopy + sys.fileIndex[p]);
      }
    }
  });

  it('narrows by residue and by start/atomsPerCopy/copies (1-based)', async () => {
    expect((await matchReference(task({ selection: { residue: 'DRG' } }), () => {})).copies).toBe(20);
    expect((await matchReference(task({ selection: { start: 1 + sys.atomsPerCopy, atomsPerCopy: sys.atomsPerCopy, copies: 5 } }), () => {})).copies).toBe(5);
  });

  it('names the first atom that does not fit', async () => {
    const err = await matchReference(task({ selection: { start: 2, atomsPerCopy: sys.atomsPerCopy, copies: 1 } }), () => {}).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(MatchError);
    expect((err as MatchError).code).toBe('molecule_not_found');
    expect((err as Error).message).toMatch(/^Atom \d+ \(/);
  });

  it('refuses a united-atom reference', async () => {
    const noH = { ...sys, elements: [] as string[], names: [] as string[], residues: [] as string[], residueNumbers: [] as number[], frames: [] as Float64Array[] };
    sys.elements.forEach((e, i) => {
      if (e === 'H') return;
      noH.elements.push(e);
      noH.names.push(sys.names[i]);
      noH.residues.push(sys.residues[i]);
      noH.residueNumbers.push(sys.residueNumbers[i]);
    });
    noH.frames = [Float64Array.from(sys.frames[0].filter((_, k) => sys.elements[Math.floor(k / 3)] !== 'H'))];
    writeFileSync(join(dir, 'ua.gro'), groText(noH as RefSystem));
    const err = await matchReference(task({ structure: { path: join(dir, 'ua.gro'), format: 'gro' } }), () => {}).catch((e: unknown) => e);
    expect((err as MatchError).code).toBe('united_atom_reference');
  });
});
