/** @vitest-environment node */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import Papa from 'papaparse';
import { Ajv2020 } from 'ajv/dist/2020.js';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { signedIn, type ApiClient } from '../helpers/client';
import { createMolecule, demoProjectId } from '../helpers/fixtures';
import { storedDrafts } from './versions-fixtures';
import type { MappingDetail } from '../../src/shared/mappings';

// Partition values in the API and the exports: an ionic bead shows "n/a (ionic)" instead of a
// partition value (CSV, JSON, PDB), a measured value with its source wins over both estimates and is
// versioned with the draft, the mapping's basis is stated, and the logP of a charged molecule carries
// a warning.

let t: TestApp;
let student: ApiClient;
let modeller: ApiClient;
let mappingId: number;
let moleculeId: number;

beforeAll(async () => {
  t = await createTestApp();
  student = await signedIn(t.app, 'student@example.org');
  modeller = await signedIn(t.app, 'modeller@example.org');
  const projectId = await demoProjectId(t.ctx.db);
  // Sodium butanoate: C0 C1 C2 C3(=O4)O5⁻ . Na6⁺
  moleculeId = await createMolecule(t.ctx.db, projectId, 'Sodium butanoate', 'CCCC(=O)[O-].[Na+]');
  const { createMapping } = await import('../../server/mappings/mappings.service');
  const draft = {
    partitionBasis: 'atoms' as const,
    beads: [
      { id: 'tail', name: 'TAIL', centre: 'mass' as const, atoms: [0, 1, 2].map((index) => ({ index, weight: 1 })), measured: { kind: 'logP' as const, value: 1.5, source: 'invented for this test' } },
      { id: 'head', name: 'HEAD', centre: 'mass' as const, atoms: [3, 4, 5].map((index) => ({ index, weight: 1 })) },
      { id: 'na', name: 'NA', centre: 'mass' as const, atoms: [{ index: 6, weight: 1 }] },
    ],
  };
  mappingId = await createMapping(t.ctx.db, moleculeId, { name: 'Salt at 3:1', resolution: '3:1' }, null as unknown as number, draft);
});
afterAll(() => t.stop());

const exported = (format: string, version = 'draft') => student.get(`/api/mappings/${mappingId}/export?format=${format}&version=${version}`).expect(200);

describe('partition values of ionic beads and measured values', () => {
  it('the evaluation marks ionic beads, keeps their additive sum apart and uses the measured value first', async () => {
    const m = (await student.get(`/api/mappings/${mappingId}`).expect(200)).body as MappingDetail;
    const [tail, head, na] = m.evaluation!.beads;
    expect(m.evaluation!.partitionBasis).toBe('atoms');
    expect(tail).toMatchObject({ ionic: false, measuredLogP: 1.5, measuredSource: 'invented for this test', partitionSource: 'measured' });
    // ΔG = ln10 · R · 298.15 K · 1.5 = 5.70803 × 1.5 = 8.562 kJ/mol (hand arithmetic, CODATA 2018 R).
    expect(tail.partitionDeltaG).toBeCloseTo(8.562, 3);
    expect(head).toMatchObject({ ionic: true, charge: -1, logP: null, deltaG: null, fragmentLogP: null, partitionSource: 'ionic', suggestedType: 'anion, 3 atoms' });
    expect(typeof head.additiveLogPIonic).toBe('number');
    expect(na).toMatchObject({ ionic: true, charge: 1, logP: null });
    expect(m.draft.beads[0].measured).toEqual({ kind: 'logP', value: 1.5, source: 'invented for this test' });
  });

  it('CSV: both ΔG columns, the measured value with its source, and n/a (ionic) for charged beads', async () => {
    const text = (await exported('csv')).text;
    const rows = Papa.parse<Record<string, string>>(text, { header: true, comments: '#', skipEmptyLines: true }).data;
    expect(rows.map((r) => [r.bead, r.ionic, r.partition_source])).toEqual([['TAIL', 'no', 'measured'], ['HEAD', 'yes', 'ionic'], ['NA', 'yes', 'ionic']]);
    expect(rows[0]).toMatchObject({ logP_measured: '1.500', measured_source: 'invented for this test', dG_OW_kJ_per_mol: '8.56' });
    expect(Number(rows[0].dG_atom_sum_kJ_per_mol)).not.toBeNaN();
    expect(Number(rows[0].dG_fragment_kJ_per_mol)).not.toBeNaN();
    for (const col of ['logP_atom_sum', 'logP_fragment', 'dG_atom_sum_kJ_per_mol', 'dG_fragment_kJ_per_mol', 'dG_OW_kJ_per_mol']) expect(rows[1][col]).toBe('n/a (ionic)');
  });

  it('JSON: n/a (ionic) in place of partition values, the raw sum under its own name, valid against the schema', async () => {
    const body = JSON.parse((await exported('json')).text);
    const ajv = new Ajv2020({ allErrors: true, strict: true, validateFormats: false });
    const validate = ajv.compile(JSON.parse(readFileSync('public/schemas/beadloom-mapping-v1.json', 'utf8')));
    expect(validate(body), JSON.stringify(validate.errors)).toBe(true);
    const head = body.evaluation.beads[1];
    expect(head).toMatchObject({ ionic: true, logP: 'n/a (ionic)', deltaG: 'n/a (ionic)', fragmentLogP: 'n/a (ionic)', partitionDeltaG: 'n/a (ionic)' });
    expect(typeof head.additiveLogPIonic).toBe('number');
    expect(body.evaluation.beads[0].measured).toMatchObject({ logP: 1.5, source: 'invented for this test' });
    expect(body.evaluation.partitionBasis).toBe('atoms');
  });

  it('the JSON content carries the measured value and the basis, and imports back with them (hash unchanged)', async () => {
    const body = JSON.parse((await exported('json')).text);
    expect(body.content.partitionBasis).toBe('atoms');
    expect(body.content.beads[0].measured).toEqual({ kind: 'logP', value: 1.5, source: 'invented for this test' });
    expect(body.content.beads[1].measured).toBeUndefined();
    const res = await modeller.post(`/api/molecules/${moleculeId}/mappings/import`, { ...body, name: 'Re-imported salt' }).expect(201);
    const copy = (await modeller.get(`/api/mappings/${res.body.id}`).expect(200)).body as MappingDetail;
    expect(copy.draft.partitionBasis).toBe('atoms');
    expect(copy.draft.beads.find((b) => b.name === 'TAIL')!.measured).toEqual({ kind: 'logP', value: 1.5, source: 'invented for this test' });
  });

  it('PDB: a REMARK 3 line per bead with its charge and partition value', async () => {
    const text = (await exported('pdb')).text;
    expect(text).toMatch(/^REMARK {3}3 bead +1 charge 0\.00 dG_OW 8\.56 kJ\/mol \(measured\)$/m);
    expect(text).toMatch(/^REMARK {3}3 bead +2 charge -1\.00 dG_OW n\/a \(ionic\)$/m);
    for (const line of text.split('\n')) expect(line.length).toBeLessThanOrEqual(80);
  });

  it('a saved version keeps the measured value and the basis', async () => {
    const { saveVersion } = await import('../../server/versions/versions.service');
    const author = (await t.ctx.db('users').where({ email: 'modeller@example.org' }).first('id')).id;
    const v = await saveVersion(t.ctx.db, await storedDrafts(t.ctx.db), mappingId, author, 'with a measured value');
    const saved = (await student.get(`/api/mappings/${mappingId}/versions/${v.number}`).expect(200)).body;
    expect(saved.draft.partitionBasis).toBe('atoms');
    expect(saved.draft.beads[0].measured).toEqual({ kind: 'logP', value: 1.5, source: 'invented for this test' });
  });
});

describe('molecule-level logP of a charged species', () => {
  it('the molecule API and the preview endpoint carry a warning; a neutral molecule none', async () => {
    const m = (await student.get(`/api/molecules/${moleculeId}`).expect(200)).body;
    expect(m.logPWarning).toMatch(/charged species/);
    const preview = (await modeller.post('/api/chem/molecule', { smiles: 'CCCCCCCCCCCCOS(=O)(=O)[O-]' }).expect(200)).body;
    expect(preview.logPWarning).toMatch(/not describe octanol\/water partitioning/);
    const neutral = (await modeller.post('/api/chem/molecule', { smiles: 'CCO' }).expect(200)).body;
    expect(neutral.logPWarning).toBeNull();
  });

  it('the evaluate endpoint refuses a measured value without its source, changing nothing', async () => {
    const res = await modeller.post('/api/chem/evaluate', { smiles: 'CCO', mapping: { beads: [{ id: 'a', name: 'A', centre: 'mass', atoms: [{ index: 0 }], measured: { kind: 'logP', value: 1, source: '' } }] } }).expect(400);
    expect(res.body.error).toMatchObject({ code: 'validation_failed', message: expect.stringMatching(/source/i) });
  });
});
