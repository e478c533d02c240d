import { describe, expect, it } from 'vitest';
import { isRigid, rigidRingEntries } from '../../../src/features/editor/model/rigid-ring';

// A four-bead ring r1–r2–r3–r4 with a substituent s on r1 (hand-made topology): making the ring rigid
// constrains its four bonds and leaves out the angles and dihedrals inside it, not those reaching s.

const ring = ['r1', 'r2', 'r3', 'r4'];
const topology: { angles: [string, string, string][]; dihedrals: [string, string, string, string][] } = {
  angles: [['r4', 'r1', 'r2'], ['r1', 'r2', 'r3'], ['r2', 'r3', 'r4'], ['r3', 'r4', 'r1'], ['s', 'r1', 'r2'], ['s', 'r1', 'r4']],
  dihedrals: [['r1', 'r2', 'r3', 'r4'], ['s', 'r1', 'r2', 'r3']],
};

describe('make ring rigid', () => {
  it('constrains the ring bonds, leaves out the angles and dihedrals inside it, keeps typed values', () => {
    const stored = { 'bond:r1,r2': { function: 'harmonic' as const, value: 0.27, k: 5000 } };
    const e = rigidRingEntries(topology, ring, stored, true);
    expect(e['bond:r1,r2']).toEqual({ function: 'harmonic', value: 0.27, k: 5000, constraint: true });
    expect(e['bond:r1,r4']).toEqual({ function: 'harmonic', value: null, k: null, constraint: true });
    expect(Object.keys(e).filter((k) => k.startsWith('bond:'))).toHaveLength(4);
    expect(Object.keys(e).filter((k) => k.startsWith('angle:')).sort()).toEqual(['angle:r1,r2,r3', 'angle:r2,r1,r4', 'angle:r2,r3,r4', 'angle:r1,r4,r3'].sort());
    expect(e['dihedral:r1,r2,r3,r4']).toMatchObject({ omit: true });
    expect(e['angle:r2,r1,s']).toBeUndefined();
    expect(isRigid(ring, e)).toBe(true);
    const undone = rigidRingEntries(topology, ring, e, false);
    expect(undone['bond:r1,r2']).toEqual({ function: 'harmonic', value: 0.27, k: 5000 });
    expect(undone['dihedral:r1,r2,r3,r4'].omit).toBeUndefined();
    expect(isRigid(ring, undone)).toBe(false);
  });
});
