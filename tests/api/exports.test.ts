/** @vitest-environment node */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import Papa from 'papaparse';
import { Ajv2020 } from 'ajv/dist/2020.js';
import JSZip from 'jszip';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { binary } from '../helpers/binary';
import { signedIn, type ApiClient } from '../helpers/client';
import { contentText } from '../../src/shared/exports';
import { versionedMapping } from './versions-fixtures';

let t: TestApp;
let student: ApiClient;
let supervisor: ApiClient;
let mappingId: number;
let moleculeId: number;

beforeAll(async () => {
  t = await createTestApp();
  student = await signedIn(t.app, 'student@example.org');
  supervisor = await signedIn(t.app, 'supervisor@example.org');
  ({ mappingId, moleculeId } = await versionedMapping(t.ctx.db, 'Export test', 2));
  await supervisor.post(`/api/mappings/${mappingId}/lock`, { version: 2 }).expect(200);
});
afterAll(() => t.stop());

const get = (format: string, version = 'production') => binary(student.get(`/api/mappings/${mappingId}/export?format=${format}&version=${version}`));

describe('exports', () => {
  it('writes a CSV mapping table that a standard CSV parser reads back', async () => {
    const res = await get('csv').expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toContain('export-test-v2.csv');
    const text = res.body.toString('utf8');
    const parsed = Papa.parse<Record<string, string>>(text, { header: true, comments: '#', skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data.map((r) => [r.bead, r.type, r.atoms])).toEqual([['A', 'C1', '1 2'], ['B', '', '3 4']]);
    const v = (await student.get(`/api/mappings/${mappingId}/versions/2`).expect(200)).body;
    expect(Number(parsed.data[0].mass)).toBeCloseTo(v.evaluation.beads[0].mass, 3);
    expect(Number(parsed.data[1].dG_atom_sum_kJ_per_mol)).toBeCloseTo(v.evaluation.beads[1].deltaG, 1);
    expect(Number(parsed.data[1].dG_OW_kJ_per_mol)).toBeCloseTo(v.evaluation.beads[1].partitionDeltaG, 1);
    expect(parsed.data[1].partition_source).toBe("fragment");
    expect(text).toContain('# mapping: Export test');
    expect(text).toContain('# version: v2 (production)');
    expect(text).toContain(`# sha256: ${v.sha256}`);
  });

  it('writes JSON that validates against the published JSON Schema, with a matching SHA-256', async () => {
    const body = JSON.parse((await get('json').expect(200)).body.toString('utf8'));
    const schema = JSON.parse(readFileSync('public/schemas/beadloom-mapping-v1.json', 'utf8'));
    const ajv = new Ajv2020({ allErrors: true, strict: true, validateFormats: false });
    const validate = ajv.compile(schema);
    expect(validate(body), JSON.stringify(validate.errors)).toBe(true);
    expect(body.mapping).toMatchObject({ name: 'Export test', version: 2, production: true });
    // Node's crypto over the stated bytes: UTF-8 of JSON.stringify(content).
    expect(createHash('sha256').update(JSON.stringify(body.content), 'utf8').digest('hex')).toBe(body.sha256);
    expect(contentText(body.content)).toBe(JSON.stringify(body.content));
    // A damaged file fails the schema.
    expect(validate({ ...body, content: { ...body.content, beads: [{ id: 'x', name: 'X', type: null, centre: 'mass', atoms: [[0, 1]] }] } })).toBe(false);
  });

  it('writes a wwPDB file that an independent PDB parser (3Dmol.js) reads back', async () => {
    const text = (await get('pdb').expect(200)).body.toString('utf8');
    expect(text.split('\n').every((l: string) => l.length <= 80)).toBe(true);
    expect(text).toMatch(/^REMARK {3}1 mapping: Export test$/m);
    expect(text).toMatch(/^REMARK {3}1 version: v2 \(production\)$/m);
    expect(text.split('\n')[0]).toBe('REMARK   1 Beadloom CG (coarse-grained) structure, one pseudo-atom per bead');
    // The full SHA-256, split over two REMARK lines as docs/exports.md says: join the halves and
    // check them with Node's crypto over the documented content (the JSON export's `content`).
    const halves = [...text.matchAll(/^REMARK {3}1 sha256 \((\d)\/2\): ([0-9a-f]{32})$/gm)].map((m) => [m[1], m[2]]);
    expect(halves.map(([k]) => k)).toEqual(['1', '2']);
    const sha = halves.map(([, h]) => h).join('');
    const json = JSON.parse((await get('json').expect(200)).body.toString('utf8'));
    expect(createHash('sha256').update(JSON.stringify(json.content), 'utf8').digest('hex')).toBe(sha);
    // 3Dmol.js's parsers only need a few browser globals to load in Node.
    const g = globalThis as Record<string, unknown>;
    g.window ??= globalThis;
    g.navigator ??= { userAgent: 'node' };
    g.document ??= { createElement: () => ({ getContext: () => null, style: {} }), addEventListener() {}, querySelectorAll: () => [] };
    const mol = (await import('3dmol')) as unknown as { Parsers: { PDB(s: string, o: object): { serial: number; x: number; y: number; z: number; bonds: number[] }[][] } };
    const atoms = mol.Parsers.PDB(text, { keepH: true, noComputeSecondaryStructure: true })[0];
    const v = (await student.get(`/api/mappings/${mappingId}/versions/2`).expect(200)).body;
    expect(atoms).toHaveLength(2);
    const pairs = new Set<string>();
    atoms.forEach((a, i) => a.bonds.forEach((j) => pairs.add([atoms[i].serial, atoms[j].serial].sort().join('-'))));
    // Propanol's two beads (C0 C1 | C2 O3) are joined by the C1–C2 bond: one CONECT pair.
    expect(v.evaluation.topology.bonds).toEqual([['a', 'b']]);
    expect([...pairs]).toEqual(['1-2']);
    // The fixture's molecule is written straight to the database, so no conformer job gives it 3D
    // coordinates: the file places each bead at the weighted mean of its atoms' 2D drawing positions,
    // 1.5 Å per bond length of the drawing, z = 0 (docs/exports.md), computed here from the stored model.
    expect(v.evaluation.beads.map((b: { centre?: unknown }) => b.centre ?? null)).toEqual([null, null]);
    expect(text).toContain('2D drawing layout');
    const model = JSON.parse((await t.ctx.db('molecules').where({ id: moleculeId }).first('model')).model) as { atoms: { x: number; y: number }[] };
    const mid = (i: number, j: number) => [(1.5 * (model.atoms[i].x + model.atoms[j].x)) / 2, (1.5 * (model.atoms[i].y + model.atoms[j].y)) / 2, 0];
    const fixed = (p: number[]) => p.map((c) => (Math.abs(c) < 5e-4 ? 0 : c).toFixed(3));
    expect(atoms.map((a) => fixed([a.x, a.y, a.z]))).toEqual([fixed(mid(0, 1)), fixed(mid(2, 3))]);
  });

  it('writes the groups text, SVG and PNG, each carrying the name, version and SHA-256', async () => {
    const v = (await student.get(`/api/mappings/${mappingId}/versions/2`).expect(200)).body;
    const groups = (await get('groups').expect(200)).body.toString('utf8');
    expect(groups.split('\n').filter((l: string) => l && !l.startsWith('#'))).toEqual(['A 1 2', 'B 3 4']);
    expect(groups.split('\n')[0]).toBe('# Beadloom atom-to-bead groups: one line per bead, its atoms as 1-based numbers');
    const csvHead = (await get('csv').expect(200)).body.toString('utf8').split('\r\n')[0];
    expect(csvHead).toMatch(/^# Beadloom mapping table: one row per bead/);
    expect(groups).toContain(v.sha256);
    const svg = (await get('svg').expect(200)).body.toString('utf8');
    expect(svg).toMatch(/^<svg xmlns="http:\/\/www.w3.org\/2000\/svg"/);
    expect(svg).toContain('<title id="t">Export test · v2 (production)</title>');
    expect(svg).toContain(v.sha256);
    const png: Buffer = (await get('png').expect(200)).body;
    expect(png.subarray(0, 8)).toEqual(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]));
    expect(png.includes(Buffer.from(`sha256 ${v.sha256}`, 'latin1'))).toBe(true);
  });

  it('exports the draft and a numbered version too', async () => {
    const draft = (await get('groups', 'draft').expect(200)).body.toString('utf8');
    expect(draft).toContain('# version: draft');
    const v1 = (await get('groups', '1').expect(200)).body.toString('utf8');
    expect(v1).toContain('# version: v1');
    // A chosen, non-production version is that version's content: its own SHA-256 in the header.
    const saved = (await student.get(`/api/mappings/${mappingId}/versions/1`).expect(200)).body;
    expect(v1).toContain(`# sha256: ${saved.sha256}`);
    const res = await get('json', '1').expect(200);
    expect(res.headers['x-content-sha256']).toBe(saved.sha256);
    expect(JSON.parse(res.body.toString('utf8')).mapping).toMatchObject({ version: 1, production: false });
  });

  it.each([
    ['an unknown format', 'format=docx&version=1', 400, 'validation_failed'],
    ['a version that does not exist', 'format=csv&version=9', 404, 'not_found'],
    ['a malformed version', 'format=csv&version=latest', 400, 'validation_failed'],
  ])('refuses %s', async (_w, query, status, code) => {
    const res = await student.get(`/api/mappings/${mappingId}/export?${query}`);
    expect(res.status).toBe(status);
    expect(res.body.error.code).toBe(code);
  });

  it('refuses production when nothing is locked', async () => {
    const { mappingId: other } = await versionedMapping(t.ctx.db, 'Not locked');
    const res = await student.get(`/api/mappings/${other}/export?format=csv&version=production`);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('no_production_version');
  });

  it('bundles every production version of the project as a zip', async () => {
    const res = await binary(student.get(`/api/projects/${(await t.ctx.db('projects').first('id')).id}/export.zip`)).expect(200);
    expect(res.headers['content-type']).toBe('application/zip');
    const zip = await JSZip.loadAsync(res.body);
    const manifest = JSON.parse(await zip.file('manifest.json')!.async('string'));
    const entry = manifest.mappings.find((m: { mappingId: number }) => m.mappingId === mappingId);
    expect(entry.version).toBe(2);
    expect(entry.files).toHaveLength(7); // csv, json, pdb, groups, ndx, svg, png
    const csv = await zip.file(entry.files.find((f: string) => f.endsWith('.csv')))!.async('string');
    expect(csv).toBe((await get('csv').expect(200)).body.toString('utf8'));
    expect(manifest.mappings.filter((m: { skipped?: string }) => m.skipped).length).toBeGreaterThan(0);
  });
});
