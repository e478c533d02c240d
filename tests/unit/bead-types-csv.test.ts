import { describe, expect, it } from 'vitest';
import { beadTypesFromCsv, beadTypesToCsv, type BeadTypeRow } from '../../src/shared/bead-types';

const rows: BeadTypeRow[] = [
  { name: 'water-loving 1, 4 atoms', heavyAtomsPerBead: 4, charge: 0, deltaGMin: -8, deltaGMax: -2, description: 'water-loving, "mild"' },
  { name: 'cation, 3 atoms', heavyAtomsPerBead: 3, charge: 1, deltaGMin: -1000, deltaGMax: 1000, description: 'charged,\nsmall' },
];

describe('bead type CSV', () => {
  it('round-trips quotes, commas and newlines; the size class is its own column, heavy atoms per bead', () => {
    const csv = beadTypesToCsv(rows);
    expect(csv.split('\n')[0]).toBe('name,heavy_atoms_per_bead,charge,delta_g_min,delta_g_max,description');
    expect(beadTypesFromCsv(csv)).toEqual({ ok: true, types: rows });
  });

  it('accepts columns in any order and without description', () => {
    const got = beadTypesFromCsv('charge,name,delta_g_max,delta_g_min,heavy_atoms_per_bead\r\n0,L1,10,4,2\r\n');
    expect(got).toEqual({ ok: true, types: [{ name: 'L1', heavyAtomsPerBead: 2, charge: 0, deltaGMin: 4, deltaGMax: 10, description: '' }] });
  });

  it('reads an older file whose size_class column says regular / small / tiny as 4 / 3 / 2', () => {
    const got = beadTypesFromCsv('name,size_class,charge,delta_g_min,delta_g_max\nA,regular,0,1,2\nB,Small,0,1,2\nC,tiny,0,1,2\n');
    expect(got).toMatchObject({ ok: true, types: [{ heavyAtomsPerBead: 4 }, { heavyAtomsPerBead: 3 }, { heavyAtomsPerBead: 2 }] });
  });

  it('names the line and field of a bad row', () => {
    const got = beadTypesFromCsv('name,heavy_atoms_per_bead,charge,delta_g_min,delta_g_max\nA,4,0,1,2\nB,5,0,1,2\n');
    expect(got).toMatchObject({ ok: false, line: 3, message: expect.stringContaining('heavyAtomsPerBead') });
    expect(beadTypesFromCsv('name,size_class,charge,delta_g_min,delta_g_max\nB,huge,0,1,2\n')).toMatchObject({ ok: false, line: 2 });
    expect(beadTypesFromCsv('name,charge\nA,0')).toMatchObject({ ok: false, line: 1, message: expect.stringContaining('heavy_atoms_per_bead') });
    expect(beadTypesFromCsv('name,heavy_atoms_per_bead,charge,delta_g_min,delta_g_max\nA,4,0,5,2')).toMatchObject({ ok: false, line: 2 });
  });
});
