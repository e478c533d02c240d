import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { signedIn, type ApiClient } from '../helpers/client';
import { demoMappingId, demoMoleculeId, demoProjectId, snapshot } from '../helpers/fixtures';
import type { MappingDetail } from '../../src/shared/mappings';

let t: TestApp;
let projectId: number;
let moleculeId: number;
let mappingId: number;
let modeller: ApiClient;
let student: ApiClient;
const TABLES = ['mappings', 'mapping_snapshots', 'mapping_updates', 'bead_types', 'bead_type_libraries'];

beforeAll(async () => {
  t = await createTestApp();
  projectId = await demoProjectId(t.ctx.db);
  moleculeId = await demoMoleculeId(t.ctx.db);
  mappingId = await demoMappingId(t.ctx.db);
  modeller = await signedIn(t.app, 'modeller@example.org');
  student = await signedIn(t.app, 'student@example.org');
});
afterAll(() => t.stop());

describe('mappings', () => {
  it('lists a molecule’s mappings and returns the draft with its evaluation', async () => {
    const list = await student.get(`/api/molecules/${moleculeId}/mappings`).expect(200);
    expect(list.body).toEqual([expect.objectContaining({ id: mappingId, name: 'C12E4 at 4:1', resolution: '4:1', beadCount: 5, locked: false })]);
    const res = await student.get(`/api/mappings/${mappingId}`).expect(200);
    const m: MappingDetail = res.body;
    expect(m.canEdit).toBe(false);
    expect(m.draft.beads.map((b) => b.name)).toEqual(['T1', 'T2', 'T3', 'E1', 'E2']);
    expect(m.evaluation?.resolution).toBe('4:1');
    expect(m.evaluation?.beads.map((b) => b.heavyAtoms)).toEqual([4, 4, 4, 3, 3]);
    // The demo leaves the last ethylene-oxide units open: C12E4 has 12 + 4 × 3 + 1 = 25 heavy atoms
    // (0–24); the five beads hold 4 + 4 + 4 + 3 + 3 = 18 of them (0–17), so atoms 18–24 are unassigned.
    const unassigned = m.evaluation?.checks.filter((c) => c.code === 'unassigned_atom') ?? [];
    expect(unassigned.map((c) => [c.severity, [...c.atoms].sort((x, y) => x - y)])).toEqual([['warning', [18, 19, 20, 21, 22, 23, 24]]]);
    expect((await modeller.get(`/api/mappings/${mappingId}`).expect(200)).body.canEdit).toBe(true);
  });

  it('creates an empty mapping and a copy of another mapping’s draft', async () => {
    const empty = await modeller.post(`/api/molecules/${moleculeId}/mappings`, { name: 'Fresh 2:1', resolution: '2:1' }).expect(201);
    expect(empty.body).toMatchObject({ name: 'Fresh 2:1', resolution: '2:1', description: '', draft: { beads: [] }, canEdit: true });
    const copy = await modeller.post(`/api/molecules/${moleculeId}/mappings`, { name: 'Copy', resolution: '4:1', copyOf: mappingId }).expect(201);
    const original = (await modeller.get(`/api/mappings/${mappingId}`).expect(200)).body;
    expect(copy.body.draft).toEqual(original.draft);
    expect(copy.body.beadCount).toBe(5);
  });

  it('lists every mapping of the project with its molecule’s name (transfer sources)', async () => {
    const res = await student.get(`/api/projects/${projectId}/mappings`).expect(200);
    const mine = (res.body as { id: number; moleculeId: number; moleculeName: string }[]).find((m) => m.id === mappingId);
    expect(mine).toMatchObject({ id: mappingId, moleculeId, name: 'C12E4 at 4:1', moleculeName: expect.any(String) });
    const counted = await t.ctx.db('mappings as p').join('molecules as m', 'm.id', 'p.molecule_id').where({ 'm.project_id': projectId, 'm.archived': false }).count({ n: '*' }).first();
    expect(res.body).toHaveLength(Number(counted?.n));
    await student.get('/api/projects/999999/mappings').expect(404);
  });

  it('changes name, description and resolution; the evaluation follows the resolution', async () => {
    const created = await modeller.post(`/api/molecules/${moleculeId}/mappings`, { name: 'To edit', resolution: '4:1', copyOf: mappingId }).expect(201);
    const res = await modeller.patch(`/api/mappings/${created.body.id}`, { name: 'Edited', description: 'Now 2:1.', resolution: '2:1' }).expect(200);
    expect(res.body).toMatchObject({ name: 'Edited', description: 'Now 2:1.', resolution: '2:1' });
    expect(res.body.evaluation.resolution).toBe('2:1');
  });

  it.each([
    ['an unknown resolution', { name: 'X', resolution: '5:1' }, 400, 'validation_failed'],
    ['no name', { resolution: '4:1' }, 400, 'validation_failed'],
    ['an unknown field', { name: 'X', resolution: '4:1', beads: [] }, 400, 'validation_failed'],
    ['a copy of a mapping of another molecule', { name: 'X', resolution: '4:1', copyOf: 2 }, 422, 'copy_source_invalid'],
    ['a copy of a mapping that does not exist', { name: 'X', resolution: '4:1', copyOf: 99999 }, 422, 'copy_source_invalid'],
  ])('refuses %s and changes nothing', async (_what, body, status, code) => {
    const before = await snapshot(t.ctx.db, TABLES);
    const res = await modeller.post(`/api/molecules/${moleculeId}/mappings`, body).expect(status);
    expect(res.body.error).toMatchObject({ code, message: expect.any(String) });
    expect(await snapshot(t.ctx.db, TABLES)).toBe(before);
  });

  it('refuses bad edits and changes nothing', async () => {
    const before = await snapshot(t.ctx.db, TABLES);
    for (const body of [{}, { resolution: '1:1' }, { name: '' }, { locked: true }]) {
      expect((await modeller.patch(`/api/mappings/${mappingId}`, body).expect(400)).body.error.code).toBe('validation_failed');
    }
    expect(await snapshot(t.ctx.db, TABLES)).toBe(before);
  });
});

describe('bead type libraries', () => {
  const lib = (types: unknown[]) => modeller.put(`/api/projects/${projectId}/bead-types`, { types });

  it('the demo project brings an illustrative library: its note once, types named in plain words, size in its own field', async () => {
    const res = await student.get(`/api/projects/${projectId}/bead-types`).expect(200);
    expect(res.body.types.length).toBeGreaterThan(10);
    expect(res.body.note).toMatch(/illustrative/i);
    for (const t of res.body.types) expect(t.description).toBe('');
    expect(res.body.types).toContainEqual(expect.objectContaining({ name: 'middle, 4 atoms', heavyAtomsPerBead: 4, charge: 0 }));
    expect(res.body.types).toContainEqual(expect.objectContaining({ name: 'anion, 2 atoms', heavyAtomsPerBead: 2, charge: -1 }));
    expect(res.body.types).toContainEqual(expect.objectContaining({ name: 'cation, 3 atoms', heavyAtomsPerBead: 3, charge: 1 }));
  });

  it('exports CSV and imports it back unchanged', async () => {
    const before = (await modeller.get(`/api/projects/${projectId}/bead-types`).expect(200)).body.types;
    const csv = await modeller.get(`/api/projects/${projectId}/bead-types?format=csv`).expect(200);
    expect(csv.headers['content-type']).toMatch(/text\/csv/);
    expect(csv.text.split('\n')[0]).toBe('name,heavy_atoms_per_bead,charge,delta_g_min,delta_g_max,description');
    const res = await modeller.put(`/api/projects/${projectId}/bead-types`, { csv: csv.text }).expect(200);
    expect(res.body.types).toEqual(before);
  });

  it('replaces the library, and suggestions come from it', async () => {
    const res = await lib([{ name: 'ANY', heavyAtomsPerBead: 4, charge: 0, deltaGMin: -1000, deltaGMax: 1000 }]).expect(200);
    expect(res.body.types).toEqual([{ name: 'ANY', heavyAtomsPerBead: 4, charge: 0, deltaGMin: -1000, deltaGMax: 1000, description: '' }]);
    expect(res.body.updatedAt).toEqual(expect.any(String));
    expect(res.body.note).toMatch(/illustrative/i); // kept when the body does not give one
    const m = (await modeller.get(`/api/mappings/${mappingId}`).expect(200)).body as MappingDetail;
    const fourAtomBeads = m.evaluation!.beads.filter((b) => b.sizeClass === 4 && !b.ionic);
    expect(fourAtomBeads.length).toBeGreaterThan(0);
    for (const b of fourAtomBeads) expect(b.suggestedType).toBe('ANY');
  });

  it.each([
    ['duplicate names', { types: [{ name: 'A', heavyAtomsPerBead: 4, charge: 0, deltaGMin: 0, deltaGMax: 1 }, { name: 'A', heavyAtomsPerBead: 3, charge: 0, deltaGMin: 0, deltaGMax: 1 }] }],
    ['a range whose minimum exceeds its maximum', { types: [{ name: 'A', heavyAtomsPerBead: 4, charge: 0, deltaGMin: 5, deltaGMax: 1 }] }],
    ['an unknown size class', { types: [{ name: 'A', heavyAtomsPerBead: 5, charge: 0, deltaGMin: 0, deltaGMax: 1 }] }],
    ['the old size words', { types: [{ name: 'A', sizeClass: 'regular', charge: 0, deltaGMin: 0, deltaGMax: 1 }] }],
    ['a fractional charge', { types: [{ name: 'A', heavyAtomsPerBead: 4, charge: 0.5, deltaGMin: 0, deltaGMax: 1 }] }],
    ['a note that is too long', { types: [], note: 'x'.repeat(501) }],
    ['a CSV row with a missing number', { csv: 'name,heavy_atoms_per_bead,charge,delta_g_min,delta_g_max\nA,4,0,,1\n' }],
    ['a CSV without its header', { csv: 'A,4,0,0,1\n' }],
    ['neither types nor csv', { rows: [] }],
  ])('refuses %s and changes nothing', async (_what, body) => {
    const before = await snapshot(t.ctx.db, TABLES);
    const res = await modeller.put(`/api/projects/${projectId}/bead-types`, body).expect(400);
    expect(res.body.error).toMatchObject({ code: 'validation_failed', message: expect.any(String) });
    expect(await snapshot(t.ctx.db, TABLES)).toBe(before);
  });
});
