import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { signedIn, type ApiClient } from '../helpers/client';
import { demoProjectId, snapshot } from '../helpers/fixtures';

// SMILES at the edges through the real app: what is not a whole SMILES is refused with its position
// and stores nothing; repeat units with attachment points are stored as such.

let t: TestApp;
let c: ApiClient;
let projectId: number;
beforeAll(async () => {
  t = await createTestApp();
  projectId = await demoProjectId(t.ctx.db);
  c = await signedIn(t.app, 'modeller@example.org');
});
afterAll(() => t.stop());

const settled = async () => {
  await t.conformers.idle();
  return snapshot(t.ctx.db, ['molecules']);
};

describe('SMILES refused with the position, nothing stored', () => {
  it.each([
    ['CC(C', 422, 'incomplete_smiles', 3],
    ['OCC(CC', 422, 'incomplete_smiles', 4],
    ['C[H-]C', 422, 'bridging_hydrogen', undefined],
    ['[#6]CC', 422, 'query_not_supported', 1],
    ['CC |$;R1$|', 422, 'cxsmiles_not_supported', 3],
  ])('%j → %i %s', async (smiles, status, code, position) => {
    const before = await settled();
    const res = await c.post(`/api/projects/${projectId}/molecules`, { name: 'Edge', smiles }).expect(status);
    expect(res.body.error.code).toBe(code);
    if (position !== undefined) expect(res.body.error.details.position).toBe(position);
    expect(await settled()).toBe(before);
    const preview = await c.post('/api/chem/molecule', { smiles }).expect(status);
    expect(preview.body.error.code).toBe(code);
  });

  it.each([
    ['CCO\u0000CCCC', 4],
    ['éc1ccccc1', 1],
    ['C\u{1F9EA}C', 2],
  ])('%j is refused by the shared schema (400) naming character %i', async (smiles, position) => {
    const before = await settled();
    for (const res of [
      await c.post(`/api/projects/${projectId}/molecules`, { name: 'Edge', smiles }).expect(400),
      await c.post('/api/chem/molecule', { smiles }).expect(400),
    ]) {
      expect(res.body.error.code).toBe('validation_failed');
      expect(JSON.stringify(res.body.error)).toContain(`Character ${position} is`);
    }
    expect(await settled()).toBe(before);
  });
});

describe('repeat units', () => {
  it('stores *CC(*)c1ccccc1 as C8H8 with two attachment points, 104.15 g/mol (CIAAW 2021: 8 × 12.011 + 8 × 1.008)', async () => {
    const res = await c.post(`/api/projects/${projectId}/molecules`, { name: 'Polystyrene unit', smiles: '*CC(*)c1ccccc1' }).expect(201);
    expect(res.body).toMatchObject({ formula: 'C8H8', heavyAtoms: 8 });
    expect(res.body.molecularWeight).toBeCloseTo(8 * 12.011 + 8 * 1.008, 9);
    const detail = (await c.get(`/api/molecules/${res.body.id}`).expect(200)).body;
    expect(detail.model.repeatUnit).toBe(true);
    expect(detail.model.attachmentPoints).toHaveLength(2);
    for (const i of detail.model.attachmentPoints) expect(detail.model.atoms[i]).toMatchObject({ element: '*', attachment: true, hydrogens: 0 });
  });
});
