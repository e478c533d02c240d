import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { csvCommentLine, readCsv, writeCsv } from '../../src/shared/csv';
import { beadTypesFromCsv, beadTypesToCsv, type BeadTypeRow } from '../../src/shared/bead-types';

// The written files are read back with papaparse's own parser (as any reader would), not with ours.
const cells = (csv: string) => Papa.parse<string[]>(csv, { skipEmptyLines: true }).data;

describe('CSV writing: spreadsheet formulae are escaped, numbers are not', () => {
  it('prefixes text cells starting with = + - @ tab or CR with a quote mark (OWASP "CSV Injection")', () => {
    const csv = writeCsv([['=HYPERLINK("http://example.org","x")', '+1+1', '-2+3+cmd', '@SUM(A1)', '\tx', '\rx', 'plain', 'a=b']], { newline: '\n' });
    expect(cells(csv)[0]).toEqual(["'=HYPERLINK(\"http://example.org\",\"x\")", "'+1+1", "'-2+3+cmd", "'@SUM(A1)", "'\tx", "'\rx", 'plain', 'a=b']);
  });

  it('writes negative numbers, and text that is only a number, as plain numbers', () => {
    const csv = writeCsv([[-0.55, '-0.550', '+3', '-1e-3', -1000]], { newline: '\n' });
    expect(csv).toBe('-0.55,-0.550,+3,-1e-3,-1000\n');
  });

  it('quotes a leading # only when asked, so comment-skipping readers keep the row', () => {
    expect(writeCsv([['#1', 'x']], { newline: '\r\n', quoteLeadingHash: true })).toBe('"#1",x\r\n');
    expect(Papa.parse<string[]>('# note\r\n"#1",x\r\n', { comments: '#', skipEmptyLines: true }).data).toEqual([['#1', 'x']]);
  });

  it('escapes a formula after a comma in a # comment line, where a spreadsheet would start a new cell', () => {
    expect(csvCommentLine('mapping: Tricky, =HYPERLINK("http://example.org")')).toBe(`# mapping: Tricky,' =HYPERLINK("http://example.org")`);
    expect(csvCommentLine('mapping: a,"=1+1"')).toBe(`# mapping: a,'"=1+1"`);
    expect(csvCommentLine('mapping: a, -3, b\nc')).toBe('# mapping: a, -3, b c');
  });
});

describe('CSV reading', () => {
  it('reads quotes, a BOM and CRLF line ends, and skips blank lines', () => {
    const text = '\ufeffname,description\r\n"a ""quoted"", name","two\r\nlines"\r\n\r\n  ,  \r\nb,c\r\n';
    expect(readCsv(text)).toEqual({ rows: [['name', 'description'], ['a "quoted", name', 'two\r\nlines'], ['b', 'c']], error: null });
  });

  it('says so when a quote is never closed', () => {
    expect(readCsv('name\n"open,1\n').error).toMatch(/quote/i);
  });
});

describe('bead type library CSV', () => {
  const tricky: BeadTypeRow[] = [
    { name: '=HYPERLINK("http://example.org","x")', heavyAtomsPerBead: 4, charge: -1, deltaGMin: -8.5, deltaGMax: -0.55, description: '-polar, @home' },
  ];

  it('exports a formula-like name escaped and the negative numbers as numbers', () => {
    const csv = beadTypesToCsv(tricky);
    const [header, row] = cells(csv);
    expect(header).toEqual(['name', 'heavy_atoms_per_bead', 'charge', 'delta_g_min', 'delta_g_max', 'description']);
    expect(row).toEqual(["'=HYPERLINK(\"http://example.org\",\"x\")", '4', '-1', '-8.5', '-0.55', "'-polar, @home"]);
    expect(csv).toContain(',-1,-8.5,-0.55,');
  });

  it('reads its own escaped cells back as the original text', () => {
    expect(beadTypesFromCsv(beadTypesToCsv(tricky))).toEqual({ ok: true, types: tricky });
  });

  it('reads a spreadsheet-saved file: BOM, CRLF, quoted cells', () => {
    const text = '\ufeffname,heavy_atoms_per_bead,charge,delta_g_min,delta_g_max,description\r\n"polar, 4 atoms",4,0,-12,-4,"says ""hi"""\r\n';
    expect(beadTypesFromCsv(text)).toEqual({ ok: true, types: [{ name: 'polar, 4 atoms', heavyAtomsPerBead: 4, charge: 0, deltaGMin: -12, deltaGMax: -4, description: 'says "hi"' }] });
  });
});
