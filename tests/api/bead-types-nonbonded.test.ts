/** @vitest-environment node */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { signedIn, type ApiClient } from '../helpers/client';
import { demoProjectId } from '../helpers/fixtures';

// Optional non-bonded parameters (σ in nm, ε in kJ/mol) in a project's bead-type library: stored,
// read back, carried by the CSV, negative values refused with nothing changed.

let t: TestApp;
let modeller: ApiClient;
let projectId: number;

beforeAll(async () => {
  t = await createTestApp();
  modeller = await signedIn(t.app, 'modeller@example.org');
  projectId = await demoProjectId(t.ctx.db);
});
afterAll(() => t.stop());

const url = () => `/api/projects/${projectId}/bead-types`;
const row = (name: string, extra: object = {}) => ({ name, heavyAtomsPerBead: 4, charge: 0, deltaGMin: -5, deltaGMax: 5, description: '', ...extra });

describe('bead-type library: non-bonded parameters', () => {
  it('stores sigma and epsilon when given and leaves them out when not', async () => {
    const res = await modeller.put(url(), { types: [row('LJ1', { sigma: 0.43, epsilon: 2.5 }), row('Plain')] }).expect(200);
    expect(res.body.types).toEqual([row('LJ1', { sigma: 0.43, epsilon: 2.5 }), row('Plain')]);
  });

  it('writes and reads them as CSV columns sigma_nm and epsilon_kj_per_mol (empty = not set)', async () => {
    const csv = (await modeller.get(`${url()}?format=csv`).expect(200)).text;
    const parsed = Papa.parse<Record<string, string>>(csv, { header: true, skipEmptyLines: true });
    expect(parsed.data.map((r) => [r.name, r.sigma_nm, r.epsilon_kj_per_mol])).toEqual([['LJ1', '0.43', '2.5'], ['Plain', '', '']]);
    const back = await modeller.put(url(), { csv }).expect(200);
    expect(back.body.types).toEqual([row('LJ1', { sigma: 0.43, epsilon: 2.5 }), row('Plain')]);
  });

  it('refuses a negative sigma or epsilon (JSON and CSV) and changes nothing', async () => {
    const before = (await modeller.get(url()).expect(200)).body.types;
    const sigma = await modeller.put(url(), { types: [row('Bad', { sigma: -0.1, epsilon: 1 })] }).expect(400);
    expect(JSON.stringify(sigma.body.error)).toContain('sigma must not be negative.');
    const epsilon = await modeller.put(url(), { types: [row('Bad', { sigma: 0.4, epsilon: -2 })] }).expect(400);
    expect(JSON.stringify(epsilon.body.error)).toContain('epsilon must not be negative.');
    const csv = await modeller.put(url(), { csv: 'name,heavy_atoms_per_bead,charge,delta_g_min,delta_g_max,sigma_nm,epsilon_kj_per_mol\nBad,4,0,-1,1,0.4,-3\n' });
    expect(csv.status).toBeGreaterThanOrEqual(400);
    expect(csv.status).toBeLessThan(500);
    expect(JSON.stringify(csv.body.error)).toContain('epsilon must not be negative.');
    expect((await modeller.get(url()).expect(200)).body.types).toEqual(before);
  });
});
