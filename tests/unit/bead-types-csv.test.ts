import { describe, expect, it } from 'vitest';
import { beadTypesFromCsv, beadTypesToCsv, type BeadTypeRow } from '../../src/shared/bead-types';

const rows: BeadTypeRow[] = [
  { name: 'W1', sizeClass: 'regular', charge: 0, deltaGMin: -8, deltaGMax: -2, description: 'water-loving, "mild"' },
  { name: 'sQ+', sizeClass: 'small', charge: 1, deltaGMin: -1000, deltaGMax: 1000, description: 'charged,\nsmall' },
];

describe('bead type CSV', () => {
  it('round-trips quotes, commas and newlines', () => {
    expect(beadTypesFromCsv(beadTypesToCsv(rows))).toEqual({ ok: true, types: rows });
  });

  it('accepts columns in any order and without description', () => {
    const got = beadTypesFromCsv('charge,name,delta_g_max,delta_g_min,size_class\r\n0,L1,10,4,tiny\r\n');
    expect(got).toEqual({ ok: true, types: [{ name: 'L1', sizeClass: 'tiny', charge: 0, deltaGMin: 4, deltaGMax: 10, description: '' }] });
  });

  it('names the line and field of a bad row', () => {
    const got = beadTypesFromCsv('name,size_class,charge,delta_g_min,delta_g_max\nA,regular,0,1,2\nB,huge,0,1,2\n');
    expect(got).toMatchObject({ ok: false, line: 3, message: expect.stringContaining('sizeClass') });
    expect(beadTypesFromCsv('name,charge\nA,0')).toMatchObject({ ok: false, line: 1, message: expect.stringContaining('size_class') });
    expect(beadTypesFromCsv('name,size_class,charge,delta_g_min,delta_g_max\nA,regular,0,5,2')).toMatchObject({ ok: false, line: 2 });
  });
});
