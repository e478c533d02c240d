import { beforeAll, describe, expect, it } from 'vitest';
import type { Molecule } from '../../../src/shared/chem';
import { parseMolecule } from '../../../server/chem';
import { BOND, layoutMolecule } from '../../../src/shared/drawing/layout';
import { hydrogenDirections } from '../../../src/shared/drawing/hydrogens';

// The drawing is made from the chemistry core's own parse, never from a second SMILES reader.

let anisole: Molecule;
let acetate: Molecule;
beforeAll(async () => {
  anisole = await parseMolecule({ smiles: 'COc1ccccc1' });
  acetate = await parseMolecule({ smiles: 'CC(=O)[O-]' });
}, 60_000); // the first parse loads RDKit's WebAssembly

describe('layoutMolecule', () => {
  it('labels hetero atoms, leaves ring carbons bare and circles the aromatic ring', () => {
    const d = layoutMolecule(anisole, false);
    const labels = d.atoms.map((a) => a.label).filter(Boolean);
    expect(labels).toEqual(['O']);
    expect(d.aromaticRings).toHaveLength(1);
    expect(d.aromaticRings[0].r).toBeGreaterThan(0.4 * BOND);
    expect(d.aromaticRings[0].r).toBeLessThan(0.7 * BOND);
    expect(d.hydrogens).toHaveLength(0);
  });

  it('draws a double bond as two lines, a charge, and OH-style labels only while hydrogens are hidden', () => {
    const d = layoutMolecule(acetate, false);
    const co = acetate.bonds.findIndex((b) => b.order === 2);
    expect(d.lines.filter((l) => l.bond === co)).toHaveLength(2);
    const minus = d.atoms.find((a) => a.charge);
    expect(minus?.charge).toBe('−');
    expect(minus?.label).toBe('O');
    const methyl = layoutMolecule({ atoms: [{ ...acetate.atoms[0] }], bonds: [] }, false);
    expect(methyl.atoms[0].label).toBe('CH₃');
  });

  it('places shown hydrogens at a bond-like distance from their own heavy atom', () => {
    const d = layoutMolecule(anisole, true);
    const total = anisole.atoms.reduce((n, a) => n + a.hydrogens, 0);
    expect(d.hydrogens).toHaveLength(total);
    for (const h of d.hydrogens) {
      const p = d.atoms[h.parent];
      expect(Math.hypot(h.x - p.x, h.y - p.y)).toBeCloseTo(0.72 * BOND, 6);
    }
  });
});

describe('hydrogenDirections', () => {
  it('keeps hydrogens off the bonds', () => {
    const dirs = hydrogenDirections({ x: 0, y: 0 }, [{ x: 1, y: 0 }], 3);
    expect(dirs).toHaveLength(3);
    for (const d of dirs) expect(Math.acos(d.x)).toBeGreaterThan(Math.PI / 3);
    const lone = hydrogenDirections({ x: 0, y: 0 }, [], 4);
    expect(lone.map((d) => Math.round(Math.atan2(d.y, d.x) * 180 / Math.PI) + 0)).toEqual([180, -90, 0, 90]);
  });
});
