import { describe, expect, it } from 'vitest';
import { parseMolecule } from '../../../server/chem/index';
import { beadCentre } from '../../../server/chem/centres';
import { prepare } from '../../../server/chem/prepared';
import { beadWeights, centresOf } from '../../../server/trajectory/bead-weights';
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
    const wrapped = Float32Array.from(whole.flatMap((c) => c.map((v) => v - Math.floor(v / 20) * 20)));
    const atoms = Int32Array.from({ length: g.total }, (_, i) => i);
    const out = new Float64Array(3 * g.total);
    wholeCopy(wrapped, atoms, order, via, box, out);
    const shift = out[0] - whole[0][0];
    whole.forEach((c, p) => c.forEach((v, k) => expect(out[3 * p + k] - (k === 0 ? shift : out[k] - whole[0][k])).toBeCloseTo(v, 4)));
  }, 30_000);
});
