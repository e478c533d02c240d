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
    // Same beads (ids, names, types, centres), placed by structure: propanol C0 C1 C2 O3 is O0 C1 C2 C3
    // read backwards in "OCCC", so A (C0, C1) lands on 2, 3 and B (C2, O3) on 0, 1.
    const byId = (d: { beads: { id: string }[] }) => Object.fromEntries(d.beads.map((b) => [b.id, b]));
    expect(byId(copy)).toEqual({
      a: { ...byId(original).a, atoms: [{ index: 2, weight: 1 }, { index: 3, weight: 1 }] },
      b: { ...byId(original).b, atoms: [{ index: 0, weight: 1 }, { index: 1, weight: 1 }] },
    });
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

describe('import by structure', () => {
  // Hexanol drawn O-last: atoms C1…C6, O7. Tail T = C1–C3, head H = C4–C6 + O7 (the OH's bead).
  const HEXANOL_BEADS = [
    { id: 't', name: 'T', centre: 'mass' as const, atoms: [1, 2, 3] },
    { id: 'h', name: 'H', centre: 'mass' as const, atoms: [4, 5, 6, 7] },
  ];

  it('puts the beads on the same chemical atoms of a molecule entered in another atom order (hexanol O-last → OCCCCCC)', async () => {
    const { mappingId, file } = await exportedDraft('CCCCCCO', HEXANOL_BEADS);
    expect(file.molecule.bonds).toHaveLength(6);
    expect(file.molecule.atoms[6]).toMatchObject({ number: 7, element: 'O', hydrogens: 1, charge: 0 });
    const target = await moleculeFromSmiles('Hexanol, OH first', 'OCCCCCC');
    const model = (await student.get(`/api/molecules/${target}`).expect(200)).body.model;
    const oxygen = model.atoms.findIndex((a: { element: string }) => a.element === 'O') + 1;
    expect(oxygen).toBe(1); // openchemlib keeps the SMILES order here: the O is atom 1 of the target

    // The preview shows where the beads would go and writes nothing.
    const before = await snapshot(t.ctx.db, TABLES);
    const preview = (await modeller.post(`/api/molecules/${target}/mappings/import`, { ...file, preview: true }).expect(200)).body;
    expect(await snapshot(t.ctx.db, TABLES)).toBe(before);
    expect(preview).toMatchObject({ preview: true, modified: false, mapping: { resolution: '2:1' }, correspondence: { method: 'structure', symmetric: false, renumbered: 6, choice: null } });
    // File atom n (C1 … C6, O7) is target atom 8 − n (O1, C2 … C7): the chain read from the other end.
    expect(preview.correspondence.atoms).toEqual([7, 6, 5, 4, 3, 2, 1]);
    const head = preview.beads.find((b: { id: string }) => b.id === 'h');
    expect(head.atoms.map(([n]: [number]) => n)).toEqual([1, 2, 3, 4]);
    expect(head.atoms.map(([n]: [number]) => model.atoms[n - 1].element)).toContain('O');

    const res = await modeller.post(`/api/molecules/${target}/mappings/import`, file).expect(201);
    expect(res.body.import.correspondence.atoms).toEqual([7, 6, 5, 4, 3, 2, 1]);
    const copy = (await student.get(`/api/mappings/${res.body.id}`).expect(200)).body;
    expect(copy.draft.beads.find((b: { id: string }) => b.id === 'h').atoms.map((a: { index: number }) => a.index + 1)).toEqual([1, 2, 3, 4]);
    // Same chemistry, so the same numbers: bead masses and ΔG equal the source's (nothing moved).
    const original = (await student.get(`/api/mappings/${mappingId}`).expect(200)).body;
    for (const id of ['t', 'h']) {
      const a = original.evaluation.beads.find((b: { id: string }) => b.id === id);
      const b = copy.evaluation.beads.find((x: { id: string }) => x.id === id);
      expect(b.mass).toBeCloseTo(a.mass, 6);
      expect(b.deltaG).toBeCloseTo(a.deltaG, 6);
    }
    const audit = (await student.get(`/api/mappings/${res.body.id}/audit`).expect(200)).body;
    expect(audit[0]).toMatchObject({ action: 'import', version: null });
    expect(audit[0].reason).toContain('6 atom number(s) differ');
    expect(audit[0].reason).not.toContain('edited');
  });

  it('says which choice it took on a symmetric molecule (diethyl ether) and keeps every bead whole', async () => {
    // Ethyl A = C1–C2, ether O3 alone, ethyl C = C4–C5.
    const { file } = await exportedDraft('CCOCC', [
      { id: 'a', name: 'A', centre: 'mass', atoms: [1, 2] },
      { id: 'o', name: 'O', centre: 'mass', atoms: [3] },
      { id: 'c', name: 'C', centre: 'mass', atoms: [4, 5] },
    ]);
    // The same molecule itself: the identity is taken, the other placement is named.
    const same = (await modeller.post(`/api/molecules/${file.__moleculeId}/mappings/import`, { ...file, preview: true }).expect(200)).body.correspondence;
    expect(same).toMatchObject({ method: 'structure', atoms: [1, 2, 3, 4, 5], renumbered: 0, symmetric: true, choiceMatters: true });
    expect(same.equivalentAtoms).toEqual([[1, 5], [2, 4]]);
    expect(same.choice).toMatch(/every atom kept its number/);
    expect(same.choice).toMatch(/file atom 1 → atom 1 \(not 5\)/);

    // Entered O first: O1, C2, C3 (on C2), C4, C5 (on C4). Either ethyl may be A; the lower numbers are taken.
    const target = await moleculeFromSmiles('Ether, O first', 'O(CC)CC');
    const res = await modeller.post(`/api/molecules/${target}/mappings/import`, file).expect(201);
    const c = res.body.import.correspondence;
    expect(c).toMatchObject({ symmetric: true, choiceMatters: true, equivalentAtoms: [[2, 4], [3, 5]] });
    expect(c.choice).toMatch(/lowest atom numbers/);
    const draft = (await student.get(`/api/mappings/${res.body.id}`).expect(200)).body.draft;
    const atomsOf = (id: string) => draft.beads.find((b: { id: string }) => b.id === id).atoms.map((a: { index: number }) => a.index + 1);
    expect(atomsOf('o')).toEqual([1]);
    expect(atomsOf('a')).toEqual([2, 3]);
    expect(atomsOf('c')).toEqual([4, 5]);
  });

  it('refuses (422 structure_mismatch) a file whose atoms and bonds are not the molecule, and changes nothing', async () => {
    const { file } = await exportedDraft('CCCCCCO', HEXANOL_BEADS);
    const target = await moleculeFromSmiles('Hexanol again', 'OCCCCCC');
    // Hand-edited: the O moved from C6 to C5 (hexan-2-ol's graph) while the SMILES line still says hexanol.
    const bonds = file.molecule.bonds.map((b: { a: number; b: number }) => (b.a === 6 && b.b === 7 ? { ...b, a: 5 } : b));
    const before = await snapshot(t.ctx.db, TABLES);
    for (const body of [{ ...file, molecule: { ...file.molecule, bonds } }, { ...file, molecule: { ...file.molecule, bonds }, preview: true }]) {
      const res = await modeller.post(`/api/molecules/${target}/mappings/import`, body).expect(422);
      expect(res.body.error).toMatchObject({ code: 'structure_mismatch', message: expect.stringContaining('Hexanol again'), details: { fileAtoms: 7, moleculeAtoms: 7 } });
    }
    // A file that lists no structure at all cannot be placed.
    const { molecule: _m, ...bare } = file;
    expect((await modeller.post(`/api/molecules/${target}/mappings/import`, bare).expect(422)).body.error.code).toBe('structure_missing');
    // An older export without bonds is placed by number only when the atoms agree number by number.
    const old = { ...file, molecule: { ...file.molecule, bonds: undefined } };
    expect((await modeller.post(`/api/molecules/${target}/mappings/import`, old).expect(422)).body.error.code).toBe('structure_mismatch');
    expect(await snapshot(t.ctx.db, TABLES)).toBe(before);
    const byNumber = await modeller.post(`/api/molecules/${file.__moleculeId}/mappings/import`, { ...old, preview: true }).expect(200);
    expect(byNumber.body.correspondence).toMatchObject({ method: 'atom-number', atoms: [1, 2, 3, 4, 5, 6, 7] });
  });

  it('imports a hand-edited file only with allowModified, and records the edit in the audit trail', async () => {
    const { file } = await exportedDraft('CCCCCCO', HEXANOL_BEADS);
    const target = await moleculeFromSmiles('Hexanol for edits', 'OCCCCCC');
    // Edited by hand: the head bead renamed and given C3 (sha256 left as exported).
    const content = { ...file.content, beads: file.content.beads.map((b: any) => (b.id === 'h' ? { ...b, name: 'Head', atoms: [[3, 1], ...b.atoms] } : { ...b, atoms: b.atoms.filter(([n]: [number]) => n !== 3) })) };
    const edited = { ...file, content };
    const before = await snapshot(t.ctx.db, TABLES);
    const refused = await modeller.post(`/api/molecules/${target}/mappings/import`, edited).expect(422);
    expect(refused.body.error).toMatchObject({ code: 'content_hash_mismatch', details: { expected: file.sha256, allowModified: false } });
    expect(refused.body.error.message).toMatch(/allowModified/);
    const preview = (await modeller.post(`/api/molecules/${target}/mappings/import`, { ...edited, preview: true }).expect(200)).body;
    expect(preview.modified).toBe(true);
    expect(await snapshot(t.ctx.db, TABLES)).toBe(before);

    const res = await modeller.post(`/api/molecules/${target}/mappings/import`, { ...edited, allowModified: true }).expect(201);
    expect(res.body.import.modified).toBe(true);
    expect(res.body.description).toMatch(/edited after export/);
    const head = (await student.get(`/api/mappings/${res.body.id}`).expect(200)).body.draft.beads.find((b: { id: string }) => b.id === 'h');
    expect(head.name).toBe('Head');
    expect(head.atoms.map((a: { index: number }) => a.index + 1)).toEqual([1, 2, 3, 4, 5]); // file atoms 7…3 → 1…5
    const audit = (await student.get(`/api/mappings/${res.body.id}/audit`).expect(200)).body;
    expect(audit).toHaveLength(1);
    expect(audit[0]).toMatchObject({ action: 'import', actor: { id: expect.any(Number) } });
    expect(audit[0].reason).toMatch(/edited after export/);
    expect((await modeller.post(`/api/molecules/${target}/mappings/import`, { ...edited, allowModified: 'yes' }).expect(400)).body.error.code).toBe('validation_failed');
  });
});

describe('JSON topology', () => {
  it('lists bonds, angles, dihedrals and rings as tuples of bead names', async () => {
    const { file } = await exportedDraft('CCCCCCO', [
      { id: 'a', name: 'A', centre: 'mass', atoms: [1, 2] },
      { id: 'b', name: 'B', centre: 'mass', atoms: [3, 4] },
      { id: 'c', name: 'C', centre: 'mass', atoms: [5] },
      { id: 'd', name: 'D', centre: 'mass', atoms: [6, 7] },
    ]);
    // Worked by hand: a chain A–B–C–D has 3 bonds, 2 angles, 1 dihedral and no ring.
    expect(file.evaluation.topology).toEqual({
      bonds: [['A', 'B'], ['B', 'C'], ['C', 'D']],
      angles: [['A', 'B', 'C'], ['B', 'C', 'D']],
      dihedrals: [['A', 'B', 'C', 'D']],
      rings: [],
    });
  });

  it('names a ring of beads, and tells apart beads that share a name', async () => {
    // Cyclohexane in three 2-atom beads, two of them both called "R": a ring of three beads.
    const { file } = await exportedDraft('C1CCCCC1', [
      { id: 'p', name: 'R', centre: 'mass', atoms: [1, 2] },
      { id: 'q', name: 'R', centre: 'mass', atoms: [3, 4] },
      { id: 's', name: 'S', centre: 'mass', atoms: [5, 6] },
    ]);
    const topo = file.evaluation.topology;
    expect(topo.bonds).toHaveLength(3);
    expect(topo.rings).toHaveLength(1);
    expect([...topo.rings[0]].sort()).toEqual(['R (p)', 'R (q)', 'S']);
    expect(topo.bonds.flat()).not.toContain('R');
  });
});

/** A molecule entered from SMILES and a mapping of it whose draft has these beads (1-based atoms); its exported draft. */
async function exportedDraft(smiles: string, beads: { id: string; name: string; centre: 'mass'; atoms: number[] }[]) {
  const moleculeId = await moleculeFromSmiles(`Source ${smiles} ${Math.random()}`, smiles);
  const { createMapping } = await import('../../server/mappings/mappings.service');
  const draft = { beads: beads.map((b) => ({ ...b, atoms: b.atoms.map((n) => ({ index: n - 1, weight: 1 })) })) };
  const mappingId = await createMapping(t.ctx.db, moleculeId, { name: `Mapping of ${smiles}`, resolution: '2:1' }, null as unknown as number, draft);
  const res = await student.get(`/api/mappings/${mappingId}/export?format=json&version=draft`).expect(200);
  return { moleculeId, mappingId, file: { ...JSON.parse(res.text), __moleculeId: moleculeId } };
}

const moleculeFromSmiles = async (name: string, smiles: string) => createMolecule(t.ctx.db, await demoProjectId(t.ctx.db), name, smiles);

/** A consistent file (its sha256 recomputed as docs/exports.md says) whose first bead has other atoms. */
function withAtoms(f: any, atoms: [number, number][]) {
  const content = { ...f.content, beads: [{ ...f.content.beads[0], atoms }, ...f.content.beads.slice(1)] };
  return { ...f, content, sha256: createHash('sha256').update(JSON.stringify(content), 'utf8').digest('hex') };
}
