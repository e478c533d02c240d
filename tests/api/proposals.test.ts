/**
 * Mapping proposals over the API (POST /api/mappings/:id/proposal) and the new ways a mapping starts
 * (start: 'proposal' | { transferFrom, version? }). The demo mapping is C12E4 at 4:1 with atoms 0–17
 * in five beads (T1–T3, E1, E2) and atoms 18–24 unassigned (tests/api/mappings.test.ts).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { signedIn, type ApiClient } from '../helpers/client';
import { createMolecule, demoMappingId, demoMoleculeId, demoProjectId, snapshot } from '../helpers/fixtures';
import type { Proposal, ProposalsResponse, TransferReport } from '../../src/shared/proposals';
import type { MappingDetail } from '../../src/shared/mappings';

let t: TestApp;
let moleculeId: number;
let mappingId: number;
let modeller: ApiClient;
const TABLES = ['mappings', 'mapping_snapshots', 'mapping_updates', 'mapping_versions'];
const range = (a: number, b: number) => Array.from({ length: b - a + 1 }, (_, i) => a + i);

beforeAll(async () => {
  t = await createTestApp();
  moleculeId = await demoMoleculeId(t.ctx.db);
  mappingId = await demoMappingId(t.ctx.db);
  modeller = await signedIn(t.app, 'modeller@example.org');
}, 60_000);
afterAll(() => t.stop());

describe('proposals', () => {
  it('completes the unassigned atoms only, names new beads after the draft’s, types them, and writes nothing', async () => {
    const before = await snapshot(t.ctx.db, TABLES);
    const res = await modeller.post(`/api/mappings/${mappingId}/proposal`, { scope: 'unassigned' }).expect(200);
    const { proposals } = res.body as ProposalsResponse;
    expect(proposals.length).toBeGreaterThanOrEqual(1);
    expect(proposals.length).toBeLessThanOrEqual(3);
    for (const p of proposals) {
      expect(p.beads.flatMap((b) => b.atoms).sort((a, b) => a - b)).toEqual(range(18, 24));
      for (const b of p.beads) {
        expect(b.name).toMatch(/^B\d+$/);
        expect(typeof b.reason).toBe('string');
        expect(b.type === null || typeof b.type === 'string').toBe(true);
      }
    }
    for (let i = 1; i < proposals.length; i++) expect(proposals[i].cost).toBeGreaterThanOrEqual(proposals[i - 1].cost);
    // The best proposal is typed from the project's library (every demo bead of 2–4 atoms has a suggestion).
    expect(proposals[0].beads.every((b) => typeof b.type === 'string')).toBe(true);
    expect(await snapshot(t.ctx.db, TABLES)).toBe(before);
  });

  it('proposes for the whole molecule, at the mapping’s or a given resolution', async () => {
    const all = (await modeller.post(`/api/mappings/${mappingId}/proposal`, { scope: 'all' }).expect(200)).body as ProposalsResponse;
    expect(all.proposals[0].beads.flatMap((b) => b.atoms).sort((a, b) => a - b)).toEqual(range(0, 24));
    // C12E4 at 4:1: the dodecyl tail is three beads of four carbons.
    expect(all.proposals[0].beads.slice(0, 3).map((b) => b.atoms)).toEqual([range(0, 3), range(4, 7), range(8, 11)]);
    const fine = (await modeller.post(`/api/mappings/${mappingId}/proposal`, { scope: 'all', resolution: '2:1' }).expect(200)).body as ProposalsResponse;
    expect(Math.max(...fine.proposals[0].beads.map((b) => b.atoms.length))).toBeLessThanOrEqual(3);
  });

  it.each([
    ['no scope', {}],
    ['an unknown scope', { scope: 'some' }],
    ['an unknown resolution', { scope: 'all', resolution: '5:1' }],
    ['an extra field', { scope: 'all', write: true }],
    ['a scope of the wrong type', { scope: 3 }],
  ])('refuses %s with 400 and changes nothing', async (_what, body) => {
    const before = await snapshot(t.ctx.db, TABLES);
    const res = await modeller.post(`/api/mappings/${mappingId}/proposal`, body).expect(400);
    expect(res.body.error).toMatchObject({ code: 'validation_failed', message: expect.any(String) });
    expect(await snapshot(t.ctx.db, TABLES)).toBe(before);
  });

  it('answers 404 for a mapping that does not exist', async () => {
    const res = await modeller.post('/api/mappings/999999/proposal', { scope: 'all' }).expect(404);
    expect(res.body.error.code).toBe('not_found');
  });
});

describe('starting a mapping', () => {
  it('starts from the proposal', async () => {
    const res = await modeller.post(`/api/molecules/${moleculeId}/mappings`, { name: 'Proposed', resolution: '4:1', start: 'proposal' }).expect(201);
    const m = res.body as MappingDetail;
    expect(m.draft.beads.flatMap((b) => b.atoms.map((a) => a.index)).sort((a, b) => a - b)).toEqual(range(0, 24));
    expect(m.evaluation?.checks.filter((c) => c.severity === 'error')).toEqual([]);
    expect(m.beadCount).toBe(m.draft.beads.length);
  });

  it('starts empty with start: "empty" and as a copy with start: { copyOf }', async () => {
    const empty = await modeller.post(`/api/molecules/${moleculeId}/mappings`, { name: 'Empty', resolution: '4:1', start: 'empty' }).expect(201);
    expect(empty.body.draft).toEqual({ beads: [] });
    const copy = await modeller.post(`/api/molecules/${moleculeId}/mappings`, { name: 'Copied', resolution: '4:1', start: { copyOf: mappingId } }).expect(201);
    expect(copy.body.draft.beads.map((b: { name: string }) => b.name)).toEqual(['T1', 'T2', 'T3', 'E1', 'E2']);
  });

  it('transfers the C12E4 mapping (draft and a saved version) to C12E6 through their common substructure', async () => {
    const projectId = await demoProjectId(t.ctx.db);
    const target = await createMolecule(t.ctx.db, projectId, 'C12E6', `${'C'.repeat(12)}${'OCC'.repeat(6)}O`);
    const res = await modeller.post(`/api/molecules/${target}/mappings`, { name: 'From C12E4', resolution: '4:1', start: { transferFrom: mappingId } }).expect(201);
    const report = res.body.transfer as TransferReport;
    // C12E4 (25 heavy atoms) lies whole inside C12E6 (31): every source bead is carried over.
    expect(report.matchedAtoms).toBe(25);
    expect(report.carried.map((b) => b.name)).toEqual(['T1', 'T2', 'T3', 'E1', 'E2']);
    expect(report.changed).toEqual([]);
    const draft = (res.body as MappingDetail).draft;
    expect(draft.beads.flatMap((b) => b.atoms.map((a) => a.index)).sort((a, b) => a - b)).toEqual(range(0, 30));
    expect(report.added.flatMap((b) => b.atoms).sort((a, b) => a - b)).toEqual(range(18, 30));
    expect(new Set(draft.beads.map((b) => b.name)).size).toBe(draft.beads.length);

    expect(report.source).toMatchObject({ mappingId, version: null, production: false, moleculeName: expect.any(String), mappingName: expect.any(String) });
    // The summary stays with the mapping, in its description.
    expect(res.body.description).toContain('Carried over: T1, T2, T3, E1, E2.');
    expect(res.body.description).toContain('(draft): 25 of 31 heavy atoms matched');

    await modeller.post(`/api/mappings/${mappingId}/versions`, { message: 'For the transfer' }).expect(201);
    const fromVersion = await modeller.post(`/api/molecules/${target}/mappings`, { name: 'From v1', resolution: '4:1', description: 'Longer EO head.', start: { transferFrom: mappingId, version: 1 } }).expect(201);
    expect((fromVersion.body.transfer as TransferReport).carried.map((b) => b.name)).toEqual(['T1', 'T2', 'T3', 'E1', 'E2']);
    expect((fromVersion.body.transfer as TransferReport).source).toMatchObject({ version: 1, production: false });
    expect(fromVersion.body.description).toMatch(/^Longer EO head\.\n\nTransferred from .*\(version 1\)/);
    // 'draft' names the draft explicitly, like no version at all.
    const fromDraft = await modeller.post(`/api/molecules/${target}/mappings`, { name: 'From the draft', resolution: '4:1', start: { transferFrom: mappingId, version: 'draft' } }).expect(201);
    expect((fromDraft.body.transfer as TransferReport).source?.version).toBeNull();
  });

  it('copies and transfers a saved version and the locked production version, not only the draft', async () => {
    const source = await modeller.post(`/api/molecules/${moleculeId}/mappings`, { name: 'Versioned source', resolution: '4:1', start: { copyOf: mappingId } }).expect(201);
    const sourceId = source.body.id as number;
    const v = await modeller.post(`/api/mappings/${sourceId}/versions`, { message: 'Five beads' }).expect(201);
    // Refused before the lock: no production version yet.
    const none = await modeller.post(`/api/molecules/${moleculeId}/mappings`, { name: 'No production', resolution: '4:1', start: { copyOf: sourceId, version: 'production' } }).expect(422);
    expect(none.body.error.code).toBe('copy_version_invalid');
    const supervisor = await signedIn(t.app, 'supervisor@example.org');
    await supervisor.post(`/api/mappings/${sourceId}/lock`, { version: v.body.number, note: 'For the copy test' }).expect(200);

    const fromVersion = await modeller.post(`/api/molecules/${moleculeId}/mappings`, { name: 'Copy of v', resolution: '4:1', start: { copyOf: sourceId, version: v.body.number } }).expect(201);
    expect(fromVersion.body.draft.beads.map((b: { name: string }) => b.name)).toEqual(['T1', 'T2', 'T3', 'E1', 'E2']);
    const fromProduction = await modeller.post(`/api/molecules/${moleculeId}/mappings`, { name: 'Copy of production', resolution: '4:1', start: { copyOf: sourceId, version: 'production' } }).expect(201);
    expect(fromProduction.body.draft.beads.map((b: { name: string }) => b.name)).toEqual(['T1', 'T2', 'T3', 'E1', 'E2']);

    const projectId = await demoProjectId(t.ctx.db);
    const target = await createMolecule(t.ctx.db, projectId, 'C12E5', `${'C'.repeat(12)}${'OCC'.repeat(5)}O`);
    const transfer = await modeller.post(`/api/molecules/${target}/mappings`, { name: 'From production', resolution: '4:1', start: { transferFrom: sourceId, version: 'production' } }).expect(201);
    expect((transfer.body.transfer as TransferReport).source).toMatchObject({ mappingId: sourceId, version: v.body.number, production: true });
    expect(transfer.body.description).toContain(`(version ${v.body.number}, production)`);
  });

  it('reports beads only partly found in the new molecule as changed', async () => {
    const projectId = await demoProjectId(t.ctx.db);
    // C10E4: the tail is two carbons shorter, so the MCS holds 23 of C12E4's 25 atoms.
    const target = await createMolecule(t.ctx.db, projectId, 'C10E4', `${'C'.repeat(10)}${'OCC'.repeat(4)}O`);
    const res = await modeller.post(`/api/molecules/${target}/mappings`, { name: 'From C12E4', resolution: '4:1', start: { transferFrom: mappingId } }).expect(201);
    const report = res.body.transfer as TransferReport;
    expect(report.matchedAtoms).toBe(23);
    expect(report.changed.length + report.carried.length).toBe(5);
    expect(report.changed.length).toBeGreaterThanOrEqual(1);
    const draft = (res.body as MappingDetail).draft;
    expect(draft.beads.flatMap((b) => b.atoms.map((a) => a.index)).sort((a, b) => a - b)).toEqual(range(0, 22));
  });

  it.each([
    ['an unknown start', { start: 'magic' }, 400, 'validation_failed'],
    ['copyOf and start together', { copyOf: 1, start: 'proposal' }, 400, 'validation_failed'],
    ['a transfer source that is no mapping', { start: { transferFrom: 999999 } }, 422, 'transfer_source_invalid'],
    ['a version the source does not have', { start: { transferFrom: 'MAPPING', version: 999 } }, 422, 'transfer_version_invalid'],
    ['a non-numeric transfer source', { start: { transferFrom: 'x' } }, 400, 'validation_failed'],
    ['an extra field in start', { start: { transferFrom: 'MAPPING', also: 1 } }, 400, 'validation_failed'],
    ['a transfer from a production version the source does not have', { start: { transferFrom: 'MAPPING', version: 'production' } }, 422, 'transfer_version_invalid'],
    ['a copy of a version the source does not have', { start: { copyOf: 'MAPPING', version: 999 } }, 422, 'copy_version_invalid'],
    ['a version that is no number, draft or production', { start: { copyOf: 'MAPPING', version: 'latest' } }, 400, 'validation_failed'],
    ['a version of zero', { start: { transferFrom: 'MAPPING', version: 0 } }, 400, 'validation_failed'],
  ])('refuses %s and creates nothing', async (_what, extra, status, code) => {
    const before = await snapshot(t.ctx.db, TABLES);
    const body = JSON.parse(JSON.stringify({ name: 'Refused', resolution: '4:1', ...extra }).replace('"MAPPING"', String(mappingId)));
    const res = await modeller.post(`/api/molecules/${moleculeId}/mappings`, body).expect(status);
    expect(res.body.error).toMatchObject({ code, message: expect.any(String) });
    expect(await snapshot(t.ctx.db, TABLES)).toBe(before);
  });
});

// Adamantane: a highly symmetric ring system, where a proposed bead may share atoms with others (each
// CH2 between two bridgeheads, at 0.5 in each). Whatever the proposal, every heavy atom's weights sum
// to 1 (a whole mapping; hand-worked), and weights, when present, are one per atom in (0, 1].
describe('proposals that may share atoms (adamantane, 4:1)', () => {
  const ADAMANTANE = 'C1C2CC3CC1CC(C2)C3';
  const expectValidWeights = (p: Proposal) => {
    for (const b of p.beads) {
      if (!('weights' in b)) continue;
      expect(b.weights).toHaveLength(b.atoms.length);
      for (const w of b.weights!) expect(w > 0 && w <= 1).toBe(true);
      // Present only when the bead shares an atom.
      expect(b.weights!.some((w) => w < 1)).toBe(true);
    }
  };
  const sums = (entries: [number, number][]) => {
    const out = new Map<number, number>();
    for (const [index, weight] of entries) out.set(index, (out.get(index) ?? 0) + weight);
    return out;
  };
  const everyAtomWhole = (s: Map<number, number>) => {
    expect([...s.keys()].sort((a, b) => a - b)).toEqual(range(0, 9));
    for (const [, w] of s) expect(Math.abs(w - 1)).toBeLessThan(1e-9);
  };

  it('proposes beads whose weights add up to 1 on every heavy atom', async () => {
    const projectId = await demoProjectId(t.ctx.db);
    const adamantane = await createMolecule(t.ctx.db, projectId, 'Adamantane', ADAMANTANE);
    const mapping = await modeller.post(`/api/molecules/${adamantane}/mappings`, { name: 'Adamantane 4:1', resolution: '4:1', start: 'empty' }).expect(201);
    const { proposals } = (await modeller.post(`/api/mappings/${mapping.body.id}/proposal`, { scope: 'all', resolution: '4:1' }).expect(200)).body as ProposalsResponse;
    expect(proposals.length).toBeGreaterThanOrEqual(1);
    for (const p of proposals) expectValidWeights(p);
    everyAtomWhole(sums(proposals[0].beads.flatMap((b) => b.atoms.map((a, k): [number, number] => [a, b.weights?.[k] ?? 1]))));
    // Adamantane has no symmetric partition into 4:1 beads, so its best proposal shares atoms
    // (docs/chemistry.md, "Mapping proposals", step 7).
    expect(proposals[0].beads.some((b) => b.weights !== undefined)).toBe(true);
  });

  it('transfers onto adamantane with the proposed beads’ weights for the atoms nothing carried holds', async () => {
    const projectId = await demoProjectId(t.ctx.db);
    const adamantane = await createMolecule(t.ctx.db, projectId, 'Adamantane (transfer)', ADAMANTANE);
    // C12E4 has no ring, and ring atoms match ring atoms only: nothing is carried, every bead is added.
    const res = await modeller.post(`/api/molecules/${adamantane}/mappings`, { name: 'Adamantane from C12E4', resolution: '4:1', start: { transferFrom: mappingId } }).expect(201);
    const report = res.body.transfer as TransferReport;
    expect(report.carried).toEqual([]);
    const draft = (res.body as MappingDetail).draft;
    everyAtomWhole(sums(draft.beads.flatMap((b) => b.atoms.map((a): [number, number] => [a.index, a.weight]))));
    expect(draft.beads.some((b) => b.atoms.some((a) => a.weight < 1))).toBe(true);
  });

  it('starts a mapping from the proposal with the same weights in its draft', async () => {
    const projectId = await demoProjectId(t.ctx.db);
    const adamantane = await createMolecule(t.ctx.db, projectId, 'Adamantane (start)', ADAMANTANE);
    const res = await modeller.post(`/api/molecules/${adamantane}/mappings`, { name: 'Proposed adamantane', resolution: '4:1', start: 'proposal' }).expect(201);
    const m = res.body as MappingDetail;
    expect(m.draft.beads.length).toBeGreaterThanOrEqual(1);
    everyAtomWhole(sums(m.draft.beads.flatMap((b) => b.atoms.map((a): [number, number] => [a.index, a.weight]))));
    expect(m.evaluation?.checks.filter((c) => c.severity === 'error')).toEqual([]);
    // The draft holds what the proposal endpoint serves for the same molecule and resolution.
    const { proposals } = (await modeller.post(`/api/mappings/${m.id}/proposal`, { scope: 'all', resolution: '4:1' }).expect(200)).body as ProposalsResponse;
    // (The draft lists beads by their lowest atom, the proposal in its own order.)
    const sorted = (beads: number[][][]) => beads.map((b) => JSON.stringify(b)).sort();
    expect(sorted(m.draft.beads.map((b) => b.atoms.map((a) => [a.index, a.weight])))).toEqual(sorted(proposals[0].beads.map((b) => b.atoms.map((a, k) => [a, b.weights?.[k] ?? 1]).sort((x, y) => x[0] - y[0]))));
  });
});
