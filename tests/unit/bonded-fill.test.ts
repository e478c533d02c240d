import { describe, expect, it } from 'vitest';
import { planFill } from '../../src/shared/bonded-fill';
import type { BondedTerm } from '../../src/shared/bonded-terms';

// The fill rule (src/shared/bonded-fill.ts) on a hand-made table and analysis: stored means and force
// constants taken as they are, the dominant cosine term of a dihedral with its phase in whole degrees,
// a row's constraint and leave-out choices kept, matching by names in either direction, and what does
// not match or cannot be used reported.

const row = (kind: BondedTerm['kind'], beads: string[], extra: Partial<BondedTerm> = {}): BondedTerm => ({ kind, beads, function: kind === 'dihedral' ? 'periodic' : 'harmonic', value: null, k: null, ...extra });
const rows: BondedTerm[] = [
  row('bond', ['A', 'B'], { constraint: true }),
  row('bond', ['B', 'C']),
  row('angle', ['A', 'B', 'C'], { function: 'cosine-harmonic', value: 100, k: 20 }),
  row('dihedral', ['A', 'B', 'C', 'D'], { omit: true }),
  row('bond', ['C', 'D']),
  row('improper', ['A', 'B', 'C', 'D'], { value: 0, k: 100 }),
];

describe('filling bonded terms from an analysis', () => {
  it('takes the stored values, keeps flags, matches either direction, reports the rest', () => {
    const plan = planFill(rows, {
      bonds: [
        { beads: ['B', 'A'], mean: 0.31, k: 24943.4 },
        { beads: ['C', 'B'], mean: 0.42, k: null },
        { beads: ['C', 'X'], mean: 0.5, k: 100 },
      ],
      angles: [{ beads: ['C', 'B', 'A'], mean: 121.5, k: 55.2 }],
      dihedrals: [{ beads: ['D', 'C', 'B', 'A'], mean: 0, k: null, fourier: [{ n: 1, k: 0.8, phase: 179.6 }, { n: 3, k: 2.4, phase: -0.4 }, { n: 2, k: 1.1, phase: 12 }] }],
    });
    const at = (i: number) => plan.updates.find((u) => u.row === i)?.params;
    expect(at(0)).toEqual({ function: 'harmonic', value: 0.31, k: 24943.4, constraint: true });
    // A cosine-harmonic row becomes harmonic: the fitted k is for a harmonic angle (kJ mol⁻¹ rad⁻²).
    expect(at(2)).toEqual({ function: 'harmonic', value: 121.5, k: 55.2 });
    // The dominant term is n = 3 (largest k); its phase −0.4° rounds to 0 (not −0).
    expect(at(3)).toEqual({ function: 'periodic', value: 0, k: 2.4, multiplicity: 3, omit: true });
    expect(Object.is(at(3)!.value, -0)).toBe(false);
    expect(at(1)).toBeUndefined();
    expect(plan.filled.map((f) => `${f.kind} ${f.beads.join('-')}`)).toEqual(['bond A-B', 'angle A-B-C', 'dihedral A-B-C-D']);
    expect(plan.skipped.map((x) => `${x.kind} ${x.beads.join('-')}`)).toEqual(['bond C-B', 'bond C-X']);
    expect(plan.skipped[0].reason).toMatch(/no spread/);
    expect(plan.skipped[1].reason).toMatch(/no bond C–X/);
    expect(plan.missing.map((x) => `${x.kind} ${x.beads.join('-')}`)).toEqual(['bond C-D']);
  });

  it('refuses fitted values outside the table\'s limits and rows whose bead names repeat', () => {
    const twice = [row('bond', ['A', 'B']), row('bond', ['B', 'A'])];
    const plan = planFill([...twice, row('bond', ['C', 'D'])], { bonds: [{ beads: ['A', 'B'], mean: 0.3, k: 10 }, { beads: ['C', 'D'], mean: 9, k: 10 }], angles: [], dihedrals: [] });
    expect(plan.updates).toEqual([]);
    expect(plan.skipped[0].reason).toMatch(/2 bonds of the draft have these bead names/);
    expect(plan.skipped[1].reason).toMatch(/from 0.01 to 5 nm/);
    expect(plan.missing).toEqual([]);
  });
});
