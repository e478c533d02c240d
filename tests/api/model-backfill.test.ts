import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { signedIn, type ApiClient } from '../helpers/client';
import { demoProjectId } from '../helpers/fixtures';
import { backfillModels } from '../../server/molecules/model-backfill.service';
import type { MoleculeSummary } from '../../src/shared/molecules';

// Rows written before canonical models existed carry only name, SMILES and notes (migration 006);
// startServer fills their model so the molecule list works for data from an older Beadloom.

let t: TestApp;
let projectId: number;
let modeller: ApiClient;

beforeAll(async () => {
  t = await createTestApp();
  projectId = await demoProjectId(t.ctx.db);
  modeller = await signedIn(t.app, 'modeller@example.org');
});
afterAll(() => t.stop());

describe('models for molecules stored before canonical models', () => {
  it('fills the model and derived columns from the stored SMILES, and the list works again', async () => {
    const [id] = await t.ctx.db('molecules').insert({ project_id: projectId, name: 'Old ethanol', smiles: 'OCC', notes: '', canonical_smiles: '', tags: '' }); // as migration 007 left such rows
    // Such a row is a server-side state, not client input: startServer backfills before it listens
    // (server/index.ts), so no request ever meets it. What the test checks is the row as it was left.
    expect(await t.ctx.db('molecules').where({ id }).first('model', 'formula')).toEqual({ model: null, formula: '' });

    expect(await backfillModels(t.ctx.db, t.ctx.log)).toBe(1);
    const list = await modeller.get(`/api/projects/${projectId}/molecules`);
    expect(list.status).toBe(200);
    const old = (list.body as MoleculeSummary[]).find((m) => m.id === id)!;
    // Ethanol C2H6O, 46.07 g/mol (CIAAW 2021 conventional weights: 2 × 12.011 + 6 × 1.008 + 15.999 = 46.069).
    expect(old).toMatchObject({ name: 'Old ethanol', smiles: 'OCC', formula: 'C2H6O', heavyAtoms: 3, tags: [] });
    expect(old.molecularWeight).toBeCloseTo(46.069, 2);
    expect((await t.ctx.db('molecules').where({ id }).first('conformer_status')).conformer_status).toMatch(/queued|running|done/);

    // Nothing left to do the second time.
    expect(await backfillModels(t.ctx.db, t.ctx.log)).toBe(0);
  });
});
