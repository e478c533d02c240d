/**
 * Property tests (fast-check): invariants any correct mapping arithmetic must keep, over random
 * partitions of real molecules and random coordinates.
 */
import fc from 'fast-check';
import { beforeAll, describe, expect, it } from 'vitest';
import { evaluateMapping, parseMolecule, type Molecule } from '../../../server/chem/index';
import type { CentreRule, Mapping } from '../../../src/shared/chem';
import { warmUpChemistry } from './warm-up';

warmUpChemistry();

const SMILES = ['CCCCCCCCCCCCOS(=O)(=O)[O-].[Na+]', 'CC(=O)Oc1ccccc1C(=O)O', 'Cn1cnc2c1c(=O)n(C)c(=O)n2C', 'OC[C@H]1OC(O)[C@H](O)[C@@H](O)[C@@H]1O', '[2H]C([2H])([2H])c1ccc(Cl)cc1'];
let molecules: Molecule[];
beforeAll(async () => {
  molecules = await Promise.all(SMILES.map((smiles) => parseMolecule({ smiles })));
});

const pointCount = (m: Molecule) => m.atoms.length + m.atoms.reduce((s, a) => s + a.hydrogens, 0);
const rules: CentreRule[] = ['mass', 'geometry', 'geometry-heavy'];

/** A random assignment of every atom to one of k beads (each atom exactly once). */
const partition = fc.record({ mol: fc.nat(SMILES.length - 1), k: fc.integer({ min: 1, max: 8 }), seed: fc.array(fc.nat(), { minLength: 60, maxLength: 60 }) });

function mappingOf(m: Molecule, k: number, seed: number[]): Mapping {
  const beads = Array.from({ length: k }, (_, i) => ({ id: `b${i}`, name: `B${i}`, centre: rules[i % 3], atoms: [] as { index: number; weight: number }[] }));
  m.atoms.forEach((a, i) => beads[seed[i % seed.length] % k].atoms.push({ index: a.index, weight: 1 }));
  return { beads };
}

describe('properties', () => {
  it('bead masses sum to the molecular weight when every atom is assigned once', () => {
    fc.assert(
      fc.property(partition, ({ mol, k, seed }) => {
        const m = molecules[mol];
        const ev = evaluateMapping(m, mappingOf(m, k, seed), { fragments: false });
        const total = ev.beads.reduce((s, b) => s + b.mass, 0);
        expect(total).toBeCloseTo(m.molecularWeight, 9);
        // An ionic bead keeps its additive sum apart from the partition values; together they still add up.
        expect(ev.beads.reduce((s, b) => s + (b.logP ?? b.additiveLogPIonic!), 0)).toBeCloseTo(m.logP, 9);
      }),
      { numRuns: 120 },
    );
  });

  it('a centre lies inside the bounding box of the points it is computed from', () => {
    const arb = fc.record({
      mol: fc.nat(SMILES.length - 1),
      xyz: fc.array(fc.tuple(fc.double({ min: -50, max: 50, noNaN: true }), fc.double({ min: -50, max: 50, noNaN: true }), fc.double({ min: -50, max: 50, noNaN: true })), { minLength: 60, maxLength: 60 }),
      pick: fc.array(fc.boolean(), { minLength: 40, maxLength: 40 }),
      weights: fc.array(fc.double({ min: 0.05, max: 1, noNaN: true }), { minLength: 40, maxLength: 40 }),
      rule: fc.constantFrom(...rules),
    });
    fc.assert(
      fc.property(arb, ({ mol, xyz, pick, weights, rule }) => {
        const m = molecules[mol];
        const coordinates = Array.from({ length: pointCount(m) }, (_, i) => [...xyz[i % xyz.length]]);
        const atoms = m.atoms.filter((_, i) => pick[i % pick.length]).map((a, i) => ({ index: a.index, weight: weights[i % weights.length] }));
        fc.pre(atoms.length > 0);
        const ev = evaluateMapping(m, { beads: [{ id: 'x', name: 'X', centre: rule, atoms }] }, { coordinates, fragments: false });
        const used: number[][] = [];
        let h = m.atoms.length;
        const hStart = m.atoms.map((a) => ((h += a.hydrogens), h - a.hydrogens));
        for (const { index } of atoms) {
          used.push(coordinates[index]);
          if (rule !== 'geometry-heavy') for (let k = 0; k < m.atoms[index].hydrogens; k++) used.push(coordinates[hStart[index] + k]);
        }
        const c = ev.beads[0].centre!;
        for (let d = 0; d < 3; d++) {
          expect(c[d]).toBeGreaterThanOrEqual(Math.min(...used.map((p) => p[d])) - 1e-9);
          expect(c[d]).toBeLessThanOrEqual(Math.max(...used.map((p) => p[d])) + 1e-9);
        }
      }),
      { numRuns: 120 },
    );
  });

  it('reassigning one atom changes only the two beads involved', () => {
    fc.assert(
      fc.property(partition, fc.nat(), fc.nat(), ({ mol, k, seed }, which, to) => {
        fc.pre(k >= 3);
        const m = molecules[mol];
        const before = mappingOf(m, k, seed);
        const atom = which % m.atoms.length;
        const from = before.beads.findIndex((b) => b.atoms.some((a) => a.index === atom));
        const target = to % k;
        fc.pre(target !== from);
        const after: Mapping = structuredClone(before);
        after.beads[from].atoms = after.beads[from].atoms.filter((a) => a.index !== atom);
        after.beads[target].atoms.push({ index: atom, weight: 1 });
        const coordinates = Array.from({ length: pointCount(m) }, (_, i) => [i, (i * 7) % 5, (i * 3) % 11]);
        const a = evaluateMapping(m, before, { coordinates });
        const b = evaluateMapping(m, after, { coordinates });
        a.beads.forEach((bead, i) => {
          if (i === from || i === target) return;
          expect(b.beads[i]).toEqual(bead);
        });
        expect(b.beads[from].mass + b.beads[target].mass).toBeCloseTo(a.beads[from].mass + a.beads[target].mass, 9);
        expect(b.beads[from].mass).not.toBeCloseTo(a.beads[from].mass, 6);
      }),
      { numRuns: 60 },
    );
  });
});
