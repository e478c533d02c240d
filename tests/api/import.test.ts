import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { signedIn, type ApiClient } from '../helpers/client';
import { createMolecule, demoProjectId, snapshot } from '../helpers/fixtures';
import { versionedMapping } from './versions-fixtures';

let t: TestApp;
let modeller: ApiClient;
let student: ApiClient;
const TABLES = ['mappings', 'mapping_snapshots', 'mapping_updates', 'mapping_versions'];

beforeAll(async () => {
  t = await createTestApp();
  modeller = await signedIn(t.app, 'modeller@example.org');
  student = await signedIn(t.app, 'student@example.org');
});
afterAll(() => t.stop());

async function exported() {
  const { moleculeId, mappingId } = await versionedMapping(t.ctx.db, `Source ${Math.random()}`, 1);
  const res = await student.get(`/api/mappings/${mappingId}/export?format=json&version=1`).expect(200);
  return { moleculeId, mappingId, file: JSON.parse(res.text) };
}

describe('import of a JSON export', () => {
  it('creates a new mapping with the same beads on a molecule with the same canonical SMILES', async () => {
    const { mappingId, file } = await exported();
    const twin = await createMolecule(t.ctx.db, await demoProjectId(t.ctx.db), 'Propanol again', 'OCCC');
    const res = await modeller.post(`/api/molecules/${twin}/mappings/import`, file).expect(201);
    expect(res.body).toMatchObject({ moleculeId: twin, name: expect.stringContaining('(imported)'), resolution: '2:1' });
    const original = (await student.get(`/api/mappings/${mappingId}/versions/1`).expect(200)).body.draft;
    const copy = (await student.get(`/api/mappings/${res.body.id}`).expect(200)).body.draft;
    expect(copy).toEqual(original);
  });

  it.each([
    ['a wrong schema', (f: any) => ({ ...f, format: 'something-else' }), 400, 'validation_failed'],
    ['beads that are not a list', (f: any) => ({ ...f, content: { ...f.content, beads: 'A' } }), 400, 'validation_failed'],
    ['an atom number out of range', (f: any) => withAtoms(f, [[99, 1]]), 422, 'atom_out_of_range'],
    ['content that does not match its sha256', (f: any) => ({ ...f, content: { ...f.content, beads: [{ ...f.content.beads[0], name: 'Tampered' }, ...f.content.beads.slice(1)] } }), 422, 'content_hash_mismatch'],
  ])('refuses %s and changes nothing', async (_w, damage, status, code) => {
    const { moleculeId, file } = await exported();
    const before = await snapshot(t.ctx.db, TABLES);
    const res = await modeller.post(`/api/molecules/${moleculeId}/mappings/import`, damage(file));
    expect(res.status).toBe(status);
    expect(res.body.error).toMatchObject({ code, message: expect.any(String) });
    expect(await snapshot(t.ctx.db, TABLES)).toBe(before);
  });

  it('refuses a different molecule, naming both structures', async () => {
    const { file } = await exported();
    const other = await createMolecule(t.ctx.db, await demoProjectId(t.ctx.db), 'Ethanol', 'CCO');
    const before = await snapshot(t.ctx.db, TABLES);
    const res = await modeller.post(`/api/molecules/${other}/mappings/import`, file).expect(422);
    expect(res.body.error.code).toBe('molecule_mismatch');
    expect(res.body.error.details).toEqual({ expected: expect.any(String), got: file.content.canonicalSmiles });
    expect(res.body.error.message).toContain(file.content.canonicalSmiles);
    expect(await snapshot(t.ctx.db, TABLES)).toBe(before);
  });

  it('accepts files above the app’s usual 1 MB body limit and refuses those over 5 MB with 413', async () => {
    const { moleculeId, file } = await exported();
    const padded = { ...file, notes: 'x'.repeat(2 * 1024 * 1024) };
    await modeller.post(`/api/molecules/${moleculeId}/mappings/import`, padded).expect(201);
    const before = await snapshot(t.ctx.db, TABLES);
    const huge = await modeller.post(`/api/molecules/${moleculeId}/mappings/import`, { ...file, notes: 'x'.repeat(5 * 1024 * 1024 + 10) });
    expect(huge.status).toBe(413);
    expect(huge.body.error.code).toBe('payload_too_large');
    expect(await snapshot(t.ctx.db, TABLES)).toBe(before);
  });

  it('refuses students', async () => {
    const { moleculeId, file } = await exported();
    expect((await student.post(`/api/molecules/${moleculeId}/mappings/import`, file)).status).toBe(403);
  });
});

/** A consistent file (its sha256 recomputed as docs/exports.md says) whose first bead has other atoms. */
function withAtoms(f: any, atoms: [number, number][]) {
  const content = { ...f.content, beads: [{ ...f.content.beads[0], atoms }, ...f.content.beads.slice(1)] };
  return { ...f, content, sha256: createHash('sha256').update(JSON.stringify(content), 'utf8').digest('hex') };
}
