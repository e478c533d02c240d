import { describe, expect, it } from 'vitest';
import { parseMolecule } from '../../../server/chem/index';
import { beadCentre } from '../../../server/chem/centres';
import { prepare } from '../../../server/chem/prepared';
import { beadWeights, centresOf } from '../../../server/trajectory/bead-weights';
import { minimumImage } from '../../../server/trajectory/box';
import { moleculeGraph, spanningOrder } from '../../../server/trajectory/molecule-graph';
import { wholeCopy } from '../../../server/trajectory/unwrap';
import type { Mapping } from '../../../src/shared/chem';

// The analysis's bead centres equal the chemistry core's (server/chem/centres.ts), shared atoms and
// every centre rule included; and a copy cut by the box is made whole again.

describe('bead centres in analyses', () => {
  it('match beadCentre for mass, geometry and geometry-heavy rules with shared weights', async () => {
    const mol = await parseMolecule({ smiles: 'OCC(=O)NCCc1ccccc1' });
    const p = prepare(mol);
    const xyz = Array.from({ length: p.totalPoints }, (_, i) => [Math.sin(i) * 5, Math.cos(3 * i) * 4, i * 0.3]);
    const mapping: Mapping = {
      beads: [
        { id: 'a', name: 'A', centre: 'mass', atoms: [{ index: 0, weight: 1 }, { index: 1, weight: 1 }, { index: 2, weight: 0.5 }] },
        { id: 'b', name: 'B', centre: 'geometry', atoms: [{ index: 2, weight: 0.5 }, { index: 3, weight: 1 }, { index: 4, weight: 1 }] },
        { id: 'c', name: 'C', centre: 'geometry-heavy', atoms: [5, 6, 7].map((index) => ({ index, weight: 1 })) },
      ],
    };
    const bw = beadWeights(p, mapping);
    const out = new Float64Array(9);
    centresOf(bw, Float64Array.from(xyz.flat()), out, 0);
    mapping.beads.forEach((b, i) => {
      const want = beadCentre(p, xyz, b.atoms, b.centre)!;
      for (let k = 0; k < 3; k++) expect(out[3 * i + k]).toBeCloseTo(want[k], 10);
    });
  }, 30_000); // the first parse loads openchemlib

  it('makes a copy whole across the box faces', async () => {
    const mol = await parseMolecule({ smiles: 'CCCCCC' });
    const g = moleculeGraph(mol);
    const { order, via } = spanningOrder(g);
    // A zig-zag chain with hydrogens nearby, straddling x = 0 of a 20 Å box.
    const whole = Array.from({ length: g.total }, (_, p) => (p < 6 ? [-3 + 1.3 * p, p % 2 ? 0.8 : 0, 5] : [-3 + 1.3 * g.parent[p] + 0.3, 1, 5.5 + 0.3 * (p % 3)]));
    const box = Float64Array.from([20, 0, 0, 0, 20, 0, 0, 0, 20]);
    const [x, y, z] = [0, 1, 2].map((k) => Float32Array.from(whole, (c) => c[k] - Math.floor(c[k] / 20) * 20));
    const atoms = Int32Array.from({ length: g.total }, (_, i) => i);
    const out = new Float64Array(3 * g.total);
    wholeCopy(x, y, z, atoms, 0, order, via, box, out);
    const shift = out[0] - whole[0][0];
    whole.forEach((c, p) => c.forEach((v, k) => expect(out[3 * p + k] - (k === 0 ? shift : out[k] - whole[0][k])).toBeCloseTo(v, 4)));
  }, 30_000);

  it('in a triclinic box, makes a copy whole exactly as box.ts minimumImage does, bond by bond', async () => {
    // wholeCopy inlines the minimum image for speed; box.ts is the reference (GROMACS's order: c, b, a).
    const mol = await parseMolecule({ smiles: 'CCOCCOCCO' });
    const g = moleculeGraph(mol);
    const { order, via } = spanningOrder(g);
    // A rhombic-dodecahedron-like reduced box (lower triangular, Å) and a chain straddling its corner.
    const box = Float64Array.from([30, 0, 0, 10, 28, 0, -8, 9, 26]);
    const whole = Array.from({ length: g.total }, (_, p) => [-2 + 1.4 * (p % 9) + 0.2 * Math.floor(p / 9), 0.7 * ((p * 7) % 5) - 1.5, 0.6 * ((p * 3) % 7) - 2]);
    // Wrap each atom on its own by whole box vectors (c, then b, then a), as a trajectory would.
    const wrapped = whole.map(([x0, y0, z0]) => {
      let [x, y, z] = [x0, y0, z0];
      const sc = Math.floor(z / box[8]);
      [x, y, z] = [x - sc * box[6], y - sc * box[7], z - sc * box[8]];
      const sb = Math.floor(y / box[4]);
      [x, y] = [x - sb * box[3], y - sb * box[4]];
      x -= Math.floor(x / box[0]) * box[0];
      return [x, y, z];
    });
    const [x, y, z] = [0, 1, 2].map((k) => Float32Array.from(wrapped, (c) => c[k]));
    const atoms = Int32Array.from({ length: g.total }, (_, i) => i);
    const out = new Float64Array(3 * g.total);
    wholeCopy(x, y, z, atoms, 0, order, via, box, out);
    const want = new Float64Array(3 * g.total);
    const d = new Float64Array(3);
    for (const p of order) {
      const from = via[p];
      if (from < 0) {
        [0, 1, 2].forEach((k) => (want[3 * p + k] = [x, y, z][k][p]));
        continue;
      }
      [0, 1, 2].forEach((k) => (d[k] = [x, y, z][k][p] - [x, y, z][k][from]));
      minimumImage(box, d);
      [0, 1, 2].forEach((k) => (want[3 * p + k] = want[3 * from + k] + d[k]));
    }
    expect(Array.from(out)).toEqual(Array.from(want));
    // And the copy is whole again: every bond as long as in the unwrapped coordinates.
    for (const p of order) {
      if (via[p] < 0) continue;
      const len = (c: ArrayLike<number>, a: number, b: number) => Math.hypot(c[3 * a] - c[3 * b], c[3 * a + 1] - c[3 * b + 1], c[3 * a + 2] - c[3 * b + 2]);
      expect(len(out, p, via[p])).toBeCloseTo(len(whole.flat(), p, via[p]), 4);
    }
  }, 30_000);
});
