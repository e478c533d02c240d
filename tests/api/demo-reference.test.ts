import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { signedIn } from '../helpers/client';
import { seedDemoReference } from '../../seeds/demo-reference';

// The demo seed's reference and analysis (what `npm start` shows at once), made by the app's own code.

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
  await seedDemoReference(t.ctx.db, t.ctx.config.dataDir);
}, 120_000);
afterAll(() => t.stop());

describe('the demo reference', () => {
  it('is ready, and its analysis is done with distributions and downloadable files', async () => {
    const student = await signedIn(t.app, 'student@example.org');
    const mapping = await t.ctx.db('mappings').where({ name: 'C12E4 at 4:1, every atom' }).first('id', 'molecule_id');
    const refs = (await student.get(`/api/molecules/${mapping.molecule_id}/references`).expect(200)).body;
    expect(refs[0]).toMatchObject({ status: 'ready', copies: 27, frames: 40 });
    const list = (await student.get(`/api/mappings/${mapping.id}/analyses`).expect(200)).body;
    const a = (await student.get(`/api/analyses/${list[0].id}`).expect(200)).body;
    expect(a).toMatchObject({ status: 'done', version: 'draft', result: { frames: 40, copies: 27 } });
    expect(a.result.bonds.length).toBeGreaterThan(0);
    await student.get(`/api/analyses/${a.id}/cg-trajectory?format=pdb`).expect(200);
  });
});
