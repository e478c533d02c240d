import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { setTimeout as sleep } from 'node:timers/promises';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { signedIn, type ApiClient } from '../helpers/client';
import { demoProjectId, snapshot } from '../helpers/fixtures';
import { flatMolfile, molfile3d, sdf } from '../helpers/molfiles';
import type { MoleculeDetail } from '../../src/shared/molecules';

let t: TestApp;
let projectId: number;
let modeller: ApiClient;
const TABLES = ['molecules', 'mappings'];
/** Background conformer jobs change molecule rows; let them finish before comparing snapshots. */
const settled = async () => {
  await t.conformers.idle();
  return snapshot(t.ctx.db, TABLES);
};

beforeAll(async () => {
  t = await createTestApp();
  projectId = await demoProjectId(t.ctx.db);
  modeller = await signedIn(t.app, 'modeller@example.org');
});
afterAll(() => t.stop());

const create = (body: unknown) => modeller.post(`/api/projects/${projectId}/molecules`, body);
const upload = (name: string, content: string | Buffer, fields: Record<string, string> = {}) => {
  let req = modeller.agent.post(`/api/projects/${projectId}/molecules/upload`).set('x-csrf-token', modeller.csrf);
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  return req.attach('file', Buffer.isBuffer(content) ? content : Buffer.from(content), name);
};

async function untilConformer(id: number): Promise<MoleculeDetail> {
  for (let i = 0; i < 300; i++) {
    const res = await modeller.get(`/api/molecules/${id}`).expect(200);
    if (res.body.coordinates.status === 'done' || res.body.coordinates.status === 'failed') return res.body;
    await sleep(100);
  }
  throw new Error('the conformer never arrived');
}

describe('molecules from SMILES', () => {
  let ethanol: MoleculeDetail;

  it('creates a molecule with the server’s canonical model and lists it', async () => {
    const res = await create({ name: 'Ethanol', smiles: 'CCO', notes: 'Solvent.', tags: ['Solvent', 'small'] }).expect(201);
    ethanol = res.body;
    expect(ethanol).toMatchObject({ name: 'Ethanol', smiles: 'CCO', formula: 'C2H6O', heavyAtoms: 3, tags: ['solvent', 'small'], archived: false, source: 'smiles', mappingCount: 0 });
    expect(ethanol.model.atoms.map((a) => a.element)).toEqual(['C', 'C', 'O']);
    expect(ethanol.molecularWeight).toBeCloseTo(46.07, 2); // CRC Handbook: ethanol 46.07 g/mol
    expect(ethanol.sketch.atoms).toHaveLength(3);
    const list = await modeller.get(`/api/projects/${projectId}/molecules`).expect(200);
    expect(list.body.map((m: { name: string }) => m.name)).toContain('Ethanol');
    expect(list.body[0]).toEqual(expect.objectContaining({ id: expect.any(Number), name: expect.any(String), smiles: expect.any(String), createdAt: expect.any(String) }));
  });

  it('searches by text and by tag', async () => {
    const byText = await modeller.get(`/api/projects/${projectId}/molecules?q=C2H6O`).expect(200);
    expect(byText.body.map((m: { name: string }) => m.name)).toEqual(['Ethanol']);
    const byTag = await modeller.get(`/api/projects/${projectId}/molecules?tag=solvent`).expect(200);
    expect(byTag.body.map((m: { name: string }) => m.name)).toEqual(['Ethanol']);
    const none = await modeller.get(`/api/projects/${projectId}/molecules?q=100%25`).expect(200);
    expect(none.body).toEqual([]);
  });

  it('generates a conformer in the background', async () => {
    const done = await untilConformer(ethanol.id);
    expect(done.coordinates).toMatchObject({ source: 'conformer', status: 'done', error: null });
    expect(done.xyz).toHaveLength(9); // 3 heavy atoms + 6 hydrogens
  });

  it('edits name, notes and tags, archives, and hides archived molecules by default', async () => {
    const res = await modeller.patch(`/api/molecules/${ethanol.id}`, { name: 'Ethyl alcohol', tags: ['alcohol'], archived: true }).expect(200);
    expect(res.body).toMatchObject({ name: 'Ethyl alcohol', tags: ['alcohol'], archived: true });
    const active = await modeller.get(`/api/projects/${projectId}/molecules`).expect(200);
    expect(active.body.map((m: { id: number }) => m.id)).not.toContain(ethanol.id);
    const archived = await modeller.get(`/api/projects/${projectId}/molecules?archived=only`).expect(200);
    expect(archived.body.map((m: { id: number }) => m.id)).toEqual([ethanol.id]);
  });

  it('deletes a molecule no mapping has versioned', async () => {
    await modeller.delete(`/api/molecules/${ethanol.id}`).expect(204);
    await modeller.get(`/api/molecules/${ethanol.id}`).expect(404);
  });

  it.each([
    ['unparseable SMILES', { name: 'Bad', smiles: 'C1CC(' }, 422],
    ['no structure', { name: 'Empty' }, 400],
    ['both smiles and molfile', { name: 'Both', smiles: 'C', molfile: 'x' }, 400],
    ['no name', { smiles: 'C' }, 400],
    ['an unknown field', { name: 'X', smiles: 'C', colour: 'red' }, 400],
    ['SMILES over the limit', { name: 'Long', smiles: 'C'.repeat(5001) }, 400],
  ])('refuses %s and changes nothing', async (_what, body, status) => {
    const before = await settled();
    const res = await create(body).expect(status);
    expect(res.body.error).toEqual({ code: expect.any(String), message: expect.any(String), ...(res.body.error.details !== undefined ? { details: res.body.error.details } : {}) });
    expect(await snapshot(t.ctx.db, TABLES)).toBe(before);
  });

  it('refuses a structure the project already has (409 duplicate_molecule with the existing molecule), unless allowDuplicate', async () => {
    const first = (await create({ name: 'Hexanol', smiles: 'CCCCCCO' }).expect(201)).body as MoleculeDetail;
    const before = await settled();
    // The same structure written another way: same canonical SMILES, so the same molecule.
    const res = await create({ name: 'Hexan-1-ol', smiles: 'OCCCCCC' }).expect(409);
    expect(res.body.error).toMatchObject({ code: 'duplicate_molecule', details: { existing: { id: first.id, name: 'Hexanol', archived: false }, canonicalSmiles: first.canonicalSmiles } });
    expect(res.body.error.message).toContain('Hexanol');
    expect(await snapshot(t.ctx.db, TABLES)).toBe(before);
    const second = await create({ name: 'Hexan-1-ol', smiles: 'OCCCCCC', allowDuplicate: true }).expect(201);
    expect(second.body.canonicalSmiles).toBe(first.canonicalSmiles);
    expect((await create({ name: 'Odd flag', smiles: 'CCCC', allowDuplicate: 'yes' }).expect(400)).body.error.code).toBe('validation_failed');
  });

  it('refuses bad edits and changes nothing', async () => {
    const id = (await create({ name: 'Propane', smiles: 'CCC' }).expect(201)).body.id;
    const before = await settled();
    for (const body of [{}, { name: '' }, { tags: 'x' }, { archived: 'yes' }, { heavyAtoms: 2 }]) {
      const res = await modeller.patch(`/api/molecules/${id}`, body).expect(400);
      expect(res.body.error.code).toBe('validation_failed');
    }
    expect(await snapshot(t.ctx.db, TABLES)).toBe(before);
  });
});

describe('uploads', () => {
  let benzene: MoleculeDetail;
  let phenol: MoleculeDetail;

  beforeAll(async () => {
    benzene = (await create({ name: 'Benzene ref', smiles: 'c1ccccc1' }).expect(201)).body;
    phenol = (await create({ name: 'Phenol ref', smiles: 'Oc1ccccc1' }).expect(201)).body;
  });

  it('imports a single molfile', async () => {
    const res = await upload('benzene.mol', flatMolfile('Benzene', benzene.model), { name: 'Uploaded benzene', allowDuplicate: 'true' }).expect(201);
    expect(res.body).toMatchObject({ created: 1, failed: 0 });
    expect(res.body.records[0]).toMatchObject({ record: 1, ok: true, molecule: { name: 'Uploaded benzene', formula: 'C6H6', source: 'molfile' } });
  });

  it('imports each record of a multi-record SD file, with a result per record', async () => {
    const broken = 'Broken\n  x\n\n  2  1  0  0  0  0  0  0  0  0999 V2000\n    0.0000    0.0000    0.0000 C   0  0\nM  END\n';
    const file = sdf([flatMolfile('Benzene from SDF', benzene.model), broken, flatMolfile('Phenol from SDF', phenol.model)]);
    const res = await upload('set.sdf', file, { allowDuplicate: 'true' }).expect(201);
    expect(res.body).toMatchObject({ created: 2, failed: 1 });
    expect(res.body.records.map((r: { record: number; name: string; ok: boolean }) => [r.record, r.name, r.ok])).toEqual([
      [1, 'Benzene from SDF', true],
      [2, 'Broken', false],
      [3, 'Phenol from SDF', true],
    ]);
    expect(res.body.records[1].error).toEqual(expect.objectContaining({ code: expect.any(String), message: expect.any(String) }));
  });

  it('reports a record whose structure the project already has as a duplicate, naming the existing molecule', async () => {
    const before = await settled();
    const res = await upload('again.mol', flatMolfile('Phenol again', phenol.model)).expect(422);
    expect(res.body.error.code).toBe('no_molecule_imported');
    expect(res.body.error.details.records[0]).toMatchObject({ ok: false, error: { code: 'duplicate_molecule', details: { existing: { id: phenol.id, name: 'Phenol ref', archived: false }, canonicalSmiles: phenol.canonicalSmiles } } });
    expect(await snapshot(t.ctx.db, TABLES)).toBe(before);
  });

  it('refuses a file that is not a molfile or SD file, and changes nothing', async () => {
    const before = await settled();
    const res = await upload('notes.txt', 'just some text\n').expect(422);
    expect(res.body.error.code).toBe('unsupported_format');
    const png = await upload('image.mol', Buffer.from([0x89, 0x50, 0x4e, 0x47, 0, 0, 0, 0])).expect(422);
    expect(png.body.error.code).toBe('unsupported_format');
    expect(await snapshot(t.ctx.db, TABLES)).toBe(before);
  });

  it('refuses a file over 2 MB, and changes nothing', async () => {
    const before = await settled();
    const big = flatMolfile('Big', benzene.model) + ' '.repeat(2 * 1024 * 1024);
    const res = await upload('big.sdf', big).expect(413);
    expect(res.body.error).toMatchObject({ code: 'payload_too_large', details: { limit: 2 * 1024 * 1024 } });
    expect(await snapshot(t.ctx.db, TABLES)).toBe(before);
  });

  it('refuses an upload without a file', async () => {
    const res = await modeller.agent.post(`/api/projects/${projectId}/molecules/upload`).set('x-csrf-token', modeller.csrf).field('name', 'Nothing').expect(400);
    expect(res.body.error.code).toBe('validation_failed');
  });

  it('attaches matching 3D coordinates to an existing molecule', async () => {
    const xyz = benzene.model.atoms.map((_a, i) => [Math.cos(i), Math.sin(i), 0.1 * i]).concat(benzene.model.atoms.map((_a, i) => [2 * Math.cos(i), 2 * Math.sin(i), 0.1 * i]));
    const res = await upload('benzene3d.mol', molfile3d('Benzene 3D', benzene.model, xyz), { moleculeId: String(benzene.id) }).expect(200);
    expect(res.body.coordinates).toMatchObject({ source: 'upload', status: 'none' });
    expect(res.body.xyz).toHaveLength(12);
    expect(res.body.xyz[0][0]).toBeCloseTo(1, 3);
    expect(res.body.model).toEqual(benzene.model); // the model, and so every atom index, is unchanged
  });

  it('refuses 3D coordinates whose atoms do not match, naming the first mismatch, and changes nothing', async () => {
    const xyz = phenol.model.atoms.map((_a, i) => [i, 0, 0.5 * i]).concat(Array.from({ length: 6 }, (_v, i) => [i, 1, 0.3]));
    const before = await settled();
    const res = await upload('phenol3d.mol', molfile3d('Phenol 3D', phenol.model, xyz), { moleculeId: String(benzene.id) }).expect(422);
    expect(res.body.error.code).toBe('structure_mismatch');
    expect(res.body.error.message).toMatch(/Atom \d+/);
    expect(res.body.error.details).toEqual(expect.objectContaining({ atom: expect.any(Number) }));
    expect(await snapshot(t.ctx.db, TABLES)).toBe(before);
  });
});
