import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { beadTypesFromCsv, beadTypesToCsv, type BeadTypeRow } from '../../src/shared/bead-types';

const rows: BeadTypeRow[] = [
  { name: 'water-loving 1, 4 atoms', heavyAtomsPerBead: 4, charge: 0, deltaGMin: -8, deltaGMax: -2, description: 'water-loving, "mild"' },
  { name: 'cation, 3 atoms', heavyAtomsPerBead: 3, charge: 1, deltaGMin: -1000, deltaGMax: 1000, description: 'charged,\nsmall' },
];

describe('bead type CSV', () => {
  it('writes quotes, commas and newlines that a standard CSV parser (papaparse) reads back; the size class is its own column', () => {
    const csv = beadTypesToCsv(rows);
    expect(csv.split(/\r?\n/)[0]).toBe('name,heavy_atoms_per_bead,charge,delta_g_min,delta_g_max,description');
    const parsed = Papa.parse<Record<string, string>>(csv, { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data).toEqual([
      { name: 'water-loving 1, 4 atoms', heavy_atoms_per_bead: '4', charge: '0', delta_g_min: '-8', delta_g_max: '-2', description: 'water-loving, "mild"' },
      { name: 'cation, 3 atoms', heavy_atoms_per_bead: '3', charge: '1', delta_g_min: '-1000', delta_g_max: '1000', description: 'charged,\nsmall' },
    ]);
  });

  it('reads a hand-written file with quoted commas, doubled quotes and a newline in a cell (RFC 4180)', () => {
    const text =
      'name,heavy_atoms_per_bead,charge,delta_g_min,delta_g_max,description\r\n' +
      '"water-loving 1, 4 atoms",4,0,-8,-2,"water-loving, ""mild"""\r\n' +
      '"cation, 3 atoms",3,1,-1000,1000,"charged,\nsmall"\r\n';
    expect(beadTypesFromCsv(text)).toEqual({ ok: true, types: rows });
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
