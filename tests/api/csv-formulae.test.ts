/** @vitest-environment node */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { signedIn, type ApiClient } from '../helpers/client';
import { createMolecule, demoProjectId } from '../helpers/fixtures';

// Spreadsheet formula escaping in the CSV exports (OWASP "CSV Injection"): a text cell starting with
// = + - @ tab or CR is written with a leading ' so Excel or LibreOffice shows it instead of running it;
// numbers — negative ΔG included — stay plain numbers. Read back with papaparse, as any reader would.

const FORMULA = '=HYPERLINK("http://example.org","click")';

let t: TestApp;
let student: ApiClient;
let modeller: ApiClient;
let projectId: number;
let mappingId: number;

beforeAll(async () => {
  t = await createTestApp();
  student = await signedIn(t.app, 'student@example.org');
  modeller = await signedIn(t.app, 'modeller@example.org');
  projectId = await demoProjectId(t.ctx.db);
  // 1-propanol: C0–C1–C2–O3.
  const moleculeId = await createMolecule(t.ctx.db, projectId, 'Propanol for CSV escaping', 'CCCO');
  const { createMapping } = await import('../../server/mappings/mappings.service');
  const draft = {
    beads: [
      { id: 'a', name: FORMULA, centre: 'mass' as const, atoms: [0, 1].map((index) => ({ index, weight: 1 })) },
      // A measured logP of −0.55 gives ΔG_OW = ln10 · R · 298.15 K · (−0.55) = 5.70803 × (−0.55) = −3.139 kJ/mol
      // (hand arithmetic, CODATA 2018 R), exported with two decimals as −3.14.
      { id: 'b', name: 'OH', centre: 'mass' as const, atoms: [2, 3].map((index) => ({ index, weight: 1 })), measured: { kind: 'logP' as const, value: -0.55, source: '@invented for this test' } },
    ],
  };
  mappingId = await createMapping(t.ctx.db, moleculeId, { name: 'Tricky, =1+1', resolution: '2:1' }, null as unknown as number, draft);
});
afterAll(() => t.stop());

describe('CSV exports escape spreadsheet formulae', () => {
  it('mapping table: a bead named =HYPERLINK(…) and an @ source are escaped, the negative ΔG is a number', async () => {
    const text = (await student.get(`/api/mappings/${mappingId}/export?format=csv&version=draft`).expect(200)).text;
    const parsed = Papa.parse<Record<string, string>>(text, { header: true, comments: '#', skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    const [a, b] = parsed.data;
    expect(a.bead).toBe(`'${FORMULA}`);
    expect(b).toMatchObject({ bead: 'OH', logP_measured: '-0.550', measured_source: "'@invented for this test", partition_source: 'measured', dG_OW_kJ_per_mol: '-3.14' });
    // Unquoted and unprefixed in the file itself, so a spreadsheet reads them as numbers.
    expect(text).toMatch(/,-0\.550,"'@invented for this test",.*,measured,-3\.14,/);
    // The mapping name's "=1+1" follows a comma in a # line, where a spreadsheet starts a new cell.
    expect(text).toContain("# mapping: Tricky,' =1+1\r\n");
  });

  it('bead type library: an escaped name and negative ΔG range export, and import back unchanged', async () => {
    const types = [{ name: FORMULA, heavyAtomsPerBead: 4, charge: -1, deltaGMin: -8.5, deltaGMax: -0.55, description: '+plus' }];
    await modeller.put(`/api/projects/${projectId}/bead-types`, { types }).expect(200);
    const csv = (await modeller.get(`/api/projects/${projectId}/bead-types?format=csv`).expect(200)).text;
    const rows = Papa.parse<string[]>(csv, { skipEmptyLines: true }).data;
    expect(rows[1]).toEqual([`'${FORMULA}`, '4', '-1', '-8.5', '-0.55', "'+plus"]);
    const back = await modeller.put(`/api/projects/${projectId}/bead-types`, { csv }).expect(200);
    expect(back.body.types).toEqual(types);
  });

  it('bead type import reads a spreadsheet-saved file with a BOM, CRLF and quoted cells', async () => {
    const csv = '\ufeffname,heavy_atoms_per_bead,charge,delta_g_min,delta_g_max,description\r\n"polar, 4 atoms",4,0,-12,-4,"says ""hi"""\r\n';
    const res = await modeller.put(`/api/projects/${projectId}/bead-types`, { csv }).expect(200);
    expect(res.body.types).toEqual([{ name: 'polar, 4 atoms', heavyAtomsPerBead: 4, charge: 0, deltaGMin: -12, deltaGMax: -4, description: 'says "hi"' }]);
  });
});
