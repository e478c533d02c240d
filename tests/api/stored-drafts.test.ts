import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { signedIn, type ApiClient } from '../helpers/client';
import { demoProjectId } from '../helpers/fixtures';
import { editDraft, propanolMapping } from './versions-fixtures';
import { assignAtoms, mappingToDoc } from '../../src/shared/mapping-doc';
import { writeSnapshot } from '../../server/drafts/drafts.service';

// Issue 18 (capacity): a mapping no live room holds is loaded from MariaDB and evaluated once per
// stored state (server/drafts/stored-drafts.ts), not on every page load or thread list. The kept copy
// must give way to every change of the draft or of an input of its evaluation, whoever made it (this
// instance, another one, a script): each change is made here, and the very next read must load again
// and show it. Reads with nothing changed in between load nothing, so the copy is really in use.

let t: TestApp;
let projectId: number;
let modeller: ApiClient;

beforeAll(async () => {
  t = await createTestApp();
  projectId = await demoProjectId(t.ctx.db);
  modeller = await signedIn(t.app, 'modeller@example.org');
});
afterAll(() => t.stop());

type Detail = { draft: { beads: { id: string; atoms: { index: number }[] }[] }; evaluation: { beads: unknown[] } | null; resolution: string };
const read = async (mappingId: number): Promise<Detail> => (await modeller.get(`/api/mappings/${mappingId}`).expect(200)).body;

/** Makes the change, then reads: one load from MariaDB in all (a change's own answer may be it), then none. */
async function loadsOnce(mappingId: number, change: () => Promise<unknown> = async () => undefined): Promise<Detail> {
  const before = t.collab.stored.loads;
  await change();
  const body = await read(mappingId);
  expect(t.collab.stored.loads - before).toBe(1);
  await modeller.get(`/api/mappings/${mappingId}/threads`).expect(200);
  expect(await read(mappingId)).toEqual(body);
  expect(t.collab.stored.loads - before).toBe(1);
  return body;
}

describe('stored drafts kept between reads', () => {
  it('loads once while nothing changes, and again after each change of the draft or its inputs', async () => {
    const { moleculeId, mappingId } = await propanolMapping(t.ctx.db, 'Kept');
    const first = await loadsOnce(mappingId);
    expect(first.evaluation).not.toBeNull();

    // 1. An update appended behind this instance's back (another instance's room, a script).
    const edited = await loadsOnce(mappingId, () => editDraft(t.ctx.db, mappingId, (doc) => assignAtoms(doc, 'a', [2])));
    expect(edited.draft.beads.map((b) => b.atoms.map((a) => a.index))).toEqual([[0, 1, 2], [3]]);
    expect(edited.evaluation).not.toEqual(first.evaluation);

    // 2. The draft written anew under the same update id.
    const doc = new Y.Doc();
    mappingToDoc(doc, { beads: [{ id: 'z', name: 'Z', centre: 'mass', atoms: [0, 1, 2, 3].map((index) => ({ index, weight: 1 })) }] });
    const rewrite = async () => {
      const row = await t.ctx.db('mapping_snapshots').where({ mapping_id: mappingId }).first('last_update_id');
      await writeSnapshot(t.ctx.db, mappingId, Y.encodeStateAsUpdate(doc), Number(row.last_update_id));
      await t.ctx.db('mapping_updates').where({ mapping_id: mappingId }).delete();
    };
    expect((await loadsOnce(mappingId, rewrite)).draft.beads.map((b) => b.id)).toEqual(['z']);

    // 3. The resolution, through the API (its answer is a read too).
    expect((await loadsOnce(mappingId, () => modeller.patch(`/api/mappings/${mappingId}`, { resolution: '3:1' }).expect(200))).resolution).toBe('3:1');

    // 4. The project's bead type library, replaced.
    const types = [{ name: 'Q9', heavyAtomsPerBead: 4, charge: 0, deltaGMin: -1, deltaGMax: 1, description: '' }];
    await loadsOnce(mappingId, () => modeller.put(`/api/projects/${projectId}/bead-types`, { types }).expect(200));

    // 5. The molecule's coordinates (a conformer arriving, an upload), written straight to MariaDB.
    await loadsOnce(mappingId, () => t.ctx.db('molecules').where({ id: moleculeId }).update({ xyz: JSON.stringify([[0, 0, 0], [1.5, 0, 0], [3, 0, 0], [4.5, 0, 0]]) }));
  });

  it('a deleted mapping is 404 at once', async () => {
    const { mappingId } = await propanolMapping(t.ctx.db, 'Gone');
    await read(mappingId);
    await t.ctx.db('mappings').where({ id: mappingId }).delete();
    await modeller.get(`/api/mappings/${mappingId}`).expect(404);
  });
});
