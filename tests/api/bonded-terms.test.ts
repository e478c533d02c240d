/** @vitest-environment node */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { signedIn, type ApiClient } from '../helpers/client';
import { createMolecule, demoProjectId } from '../helpers/fixtures';
import { versionedMapping } from './versions-fixtures';
import { until } from '../helpers/collab-client';

// The bonded-terms table through the API: every term of the draft's CG topology listed (nulls where
// not set), PUT refused with each problem named and nothing changed, the terms saved with a version,
// and the missing-value check in the draft's checks.

let t: TestApp;
let modeller: ApiClient;
let mappingId: number;

/** Butane C0–C1–C2–C3 as four one-atom beads: 3 bonds, 2 angles, 1 dihedral. */
async function butane(): Promise<number> {
  const moleculeId = await createMolecule(t.ctx.db, await demoProjectId(t.ctx.db), 'Butane for bonded terms', 'CCCC');
  const { createMapping } = await import('../../server/mappings/mappings.service');
  const bead = (id: string, index: number) => ({ id, name: id.toUpperCase(), centre: 'mass' as const, atoms: [{ index, weight: 1 }] });
  return createMapping(t.ctx.db, moleculeId, { name: 'Butane 1:1', resolution: '2:1' }, null as unknown as number, { beads: [bead('a', 0), bead('b', 1), bead('c', 2), bead('d', 3)] });
}

beforeAll(async () => {
  t = await createTestApp();
  modeller = await signedIn(t.app, 'modeller@example.org');
  mappingId = await butane();
});
afterAll(() => t.stop());

const url = () => `/api/mappings/${mappingId}/bonded-terms`;
const full = [
  { kind: 'bond', beads: ['A', 'B'], function: 'harmonic', value: 0.47, k: 1250 },
  { kind: 'bond', beads: ['C', 'B'], function: 'harmonic', value: 0.47, k: null, constraint: true },
  { kind: 'bond', beads: ['C', 'D'], function: 'harmonic', value: 0.47, k: 1250 },
  { kind: 'angle', beads: ['A', 'B', 'C'], function: 'harmonic', value: 120, k: 25 },
  { kind: 'angle', beads: ['B', 'C', 'D'], function: 'cosine-harmonic', value: 120, k: 25 },
  { kind: 'dihedral', beads: ['D', 'C', 'B', 'A'], function: 'periodic', value: 0, k: 1.5, multiplicity: 3 },
];

describe('bonded terms', () => {
  it('lists every bond, angle and dihedral of the topology with nulls where nothing is set', async () => {
    const body = (await modeller.get(url()).expect(200)).body;
    expect(body.exclusions).toBeNull();
    expect(body.terms.map((x: { kind: string; beads: string[] }) => `${x.kind} ${x.beads.join('-')}`)).toEqual(['bond A-B', 'bond B-C', 'bond C-D', 'angle A-B-C', 'angle B-C-D', 'dihedral A-B-C-D']);
    expect(body.terms.every((x: { value: unknown; k: unknown }) => x.value === null && x.k === null)).toBe(true);
  });

  it('refuses bad rows with each problem named, and changes nothing', async () => {
    const bad = await modeller.put(url(), { terms: [{ kind: 'bond', beads: ['A', 'C'], function: 'harmonic', value: 0.5, k: 100 }, { kind: 'angle', beads: ['A', 'B', 'Z'], function: 'harmonic', value: 100, k: 10 }] }).expect(422);
    expect(bad.body.error.code).toBe('bonded_terms_invalid');
    expect(bad.body.error.message).toContain('term 1: A–C is not a bond');
    expect(bad.body.error.message).toContain('term 2: No bead is named "Z"');
    const negative = await modeller.put(url(), { terms: [{ kind: 'bond', beads: ['A', 'B'], function: 'harmonic', value: 0.5, k: -1 }] }).expect(400);
    expect(JSON.stringify(negative.body.error)).toMatch(/force constant lies from 0/);
    await modeller.put(url(), { terms: [{ kind: 'angle', beads: ['A', 'B', 'C'], function: 'periodic', value: 100, k: 1 }] }).expect(400);
    await modeller.put(url(), { terms: [], exclusions: 9 }).expect(400);
    const after = (await modeller.get(url()).expect(200)).body;
    expect(after.terms.every((x: { value: unknown }) => x.value === null)).toBe(true);
  });

  it('an unknown analysis is a 404, not a made-up fill', async () => {
    const res = await modeller.put(url(), { fromAnalysis: 987654 }).expect(404);
    expect(res.body.error.code).toBe('not_found');
  });

  it('an engine export of a table with missing values is refused with each one named, and so are bad parameters', async () => {
    const res = await modeller.get(`/api/mappings/${mappingId}/export?format=gromacs&version=draft`).expect(422);
    expect(res.body.error.code).toBe('model_incomplete');
    const checks = res.body.error.details.problems.map((p: { check: string; message: string }) => `${p.check}: ${p.message}`);
    expect(checks).toContain('bonded_value_missing: bond A–B: not set.');
    expect(checks).toContain('bonded_value_missing: dihedral A–B–C–D: not set.');
    expect(checks).toContain('exclusions_missing: No exclusion count set.');
    expect(checks).toContain('bead_type_missing: Bead A has no bead type.');
    expect((await modeller.get(`/api/mappings/${mappingId}/export?format=lammps&units=3`).expect(422)).body.error.code).toBe('not_a_repeat_unit');
    expect((await modeller.get(`/api/mappings/${mappingId}/export?format=gromacs&analysis=424242`).expect(404)).body.error.code).toBe('not_found');
    expect((await modeller.get(`/api/mappings/${mappingId}/export?format=csv&units=3`).expect(422)).body.error.code).toBe('engine_only');
  });

  it('stores the table in the draft: read back in canonical direction, missing values are error checks, saved with a version', async () => {
    const half = await modeller.put(url(), { terms: full.slice(0, 3), exclusions: 1 }).expect(200);
    expect(half.body.exclusions).toBe(1);
    expect(half.body.terms[1]).toEqual({ kind: 'bond', beads: ['B', 'C'], function: 'harmonic', value: 0.47, k: null, constraint: true });
    // The evaluation of the edited draft says which terms still lack numbers (error level).
    const missingChecks = async () => (await t.collab.read(mappingId)).result.evaluation?.checks.filter((c) => c.code === 'bonded_value_missing') ?? [];
    await until('the edited draft evaluated', async () => (await missingChecks()).length === 3);
    const checks = await missingChecks();
    expect(checks.every((c) => c.severity === 'error')).toBe(true);
    expect(checks.map((c) => c.message)).toContain('dihedral A–B–C–D: no phase, no force constant, no multiplicity.');
    const done = await modeller.put(url(), { terms: full, exclusions: 1 }).expect(200);
    expect(done.body.terms.find((x: { kind: string }) => x.kind === 'dihedral')).toMatchObject({ beads: ['A', 'B', 'C', 'D'], value: 0, k: 1.5, multiplicity: 3 });
    const saved = await modeller.post(`/api/mappings/${mappingId}/versions`, { message: 'with bonded terms' }).expect(201);
    const version = (await modeller.get(`/api/mappings/${mappingId}/versions/${saved.body.number}`).expect(200)).body;
    expect(version.draft.exclusions).toBe(1);
    expect(Object.keys(version.draft.bonded)).toHaveLength(6);
    expect(version.draft.bonded['bond:b,c']).toEqual({ function: 'harmonic', value: 0.47, k: null, constraint: true });
    expect(version.evaluation.checks.filter((c: { code: string }) => c.code.startsWith('bonded') || c.code === 'exclusions_missing')).toEqual([]);
  });

  it('a mapping without bonded terms hashes as before (propanol fixture keeps its content)', async () => {
    const { mappingId: other } = await versionedMapping(t.ctx.db, 'Bonded hash check');
    const v = (await modeller.get(`/api/mappings/${other}/versions/1`).expect(200)).body;
    expect(v.draft.bonded).toBeUndefined();
  });
});
