/** @vitest-environment node */
/**
 * The engine exports checked by the engines themselves (Debian's GROMACS 2022.5 and LAMMPS 29 Sep 2021;
 * GMX_PATH and LMP_PATH from `npm test`): for invented molecules (a non-ionic surfactant, a
 * ring-containing drug with a rigid ring, a salt) `gmx grompp` must accept the GROMACS files (its
 * warnings are printed), and LAMMPS must run the exported model 10,000 steps with finite energies,
 * each CG bond's mean length within 5% of the exported r0. `gmx mdrun` is tried; on machines whose CPU
 * lacks rdtscp Debian's build stops at start, and the test says so and relies on grompp and LAMMPS.
 */
import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import JSZip from 'jszip';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BondedTerm } from '../../src/shared/bonded-terms';
import type { Vec3 } from '../../src/shared/chem';
import { setResidue } from '../../src/shared/mapping-doc';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { binary } from '../helpers/binary';
import { signedIn, type ApiClient } from '../helpers/client';
import { until } from '../helpers/collab-client';
import { chainOrder, mappedMolecule, neighbours, ringOrder, termsAtGeometry, type Fixture } from './engine-fixtures';

const GMX = process.env.GMX_PATH ?? '/usr/bin/gmx';
const LMP = process.env.LMP_PATH ?? '/usr/bin/lmp';
const work = mkdtempSync(join(tmpdir(), 'beadloom-engines-'));

let t: TestApp;
let modeller: ApiClient;

beforeAll(async () => {
  t = await createTestApp();
  modeller = await signedIn(t.app, 'modeller@example.org');
});
afterAll(async () => {
  await t.stop();
  rmSync(work, { recursive: true, force: true });
});

/** The draft's evaluation once it has bead centres (the conformer is stored before the mapping). */
async function evaluated(mappingId: number) {
  let evaluation = (await t.collab.read(mappingId)).result.evaluation;
  await until('the draft evaluated with 3D centres', async () => {
    evaluation = (await t.collab.read(mappingId)).result.evaluation;
    return !!evaluation && evaluation.beads.every((b) => b.centre !== null);
  });
  return evaluation!;
}

/** Fills the table at the starting geometry, saves a version and downloads both engine zips into folders. */
async function exportBoth(f: Fixture, label: string, options: Parameters<typeof termsAtGeometry>[2] = {}, exclusions = 1, chain?: { units: number; shift: Vec3 }, extra: (centre: (name: string) => Vec3) => BondedTerm[] = () => []): Promise<{ gromacs: string; lammps: string; version: number }> {
  const evaluation = await evaluated(f.mappingId);
  // "A++" is bead A two units on: its centre moved twice by the chain's shift.
  const centre = (ref: string): Vec3 => {
    const u = /\+*$/.exec(ref)![0].length;
    const c = evaluation.beads.find((b) => b.name === ref.slice(0, ref.length - u))!.centre!;
    const d = chain?.shift ?? [0, 0, 0];
    return [c[0] + u * d[0], c[1] + u * d[1], c[2] + u * d[2]];
  };
  const rows: BondedTerm[] = (await modeller.get(`/api/mappings/${f.mappingId}/bonded-terms`).expect(200)).body.terms;
  await modeller.put(`/api/mappings/${f.mappingId}/bonded-terms`, { terms: [...termsAtGeometry(rows, centre, options), ...extra(centre)], exclusions }).expect(200);
  const version = (await modeller.post(`/api/mappings/${f.mappingId}/versions`, { message: 'for the engines' }).expect(201)).body.number as number;
  const out = { version, gromacs: '', lammps: '' };
  for (const format of ['gromacs', 'lammps'] as const) {
    const res = await binary(modeller.get(`/api/mappings/${f.mappingId}/export?format=${format}&version=${version}${chain ? `&units=${chain.units}` : ''}`)).expect(200);
    expect(res.headers['content-type']).toBe('application/zip');
    const zip = await JSZip.loadAsync(res.body);
    const dir = join(work, `${label}-${format}`);
    mkdirSync(dir, { recursive: true });
    for (const [path, entry] of Object.entries(zip.files)) {
      if (entry.dir) continue;
      writeFileSync(join(dir, path.split('/').pop()!), await entry.async('nodebuffer'));
    }
    out[format] = dir;
  }
  return out;
}

function grompp(dir: string, label: string): void {
  const run = spawnSync(GMX, ['-quiet', 'grompp', '-f', 'md.mdp', '-c', 'conf.gro', '-p', 'topol.top', '-o', 'run.tpr', '-maxwarn', '20'], { cwd: dir, encoding: 'utf8' });
  const out = `${run.stdout}\n${run.stderr}`;
  const warnings = [...out.matchAll(/WARNING \d+ \[[^\]]*\]:\n([\s\S]*?)\n\n/g)].map((m) => m[1].replace(/\s+/g, ' ').trim());
  const notes = [...out.matchAll(/NOTE \d+ \[[^\]]*\]:\n([\s\S]*?)\n\n/g)].map((m) => m[1].replace(/\s+/g, ' ').trim());
  console.log(`[${label}] gmx grompp exit ${run.status}; ${warnings.length} warning(s)${warnings.map((w) => `\n  WARNING: ${w}`).join('')}${notes.map((n) => `\n  NOTE: ${n}`).join('')}`);
  expect(out).not.toMatch(/ERROR \d+ \[/);
  expect(run.status, out.slice(-2000)).toBe(0);
  // mdrun: Debian's build needs the rdtscp instruction; where it starts, run the 10,000 steps.
  const md = spawnSync(GMX, ['-quiet', 'mdrun', '-s', 'run.tpr', '-nt', '1', '-deffnm', 'md'], { cwd: dir, encoding: 'utf8', timeout: 300_000 });
  if (md.status === 0) {
    console.log(`[${label}] gmx mdrun ran the 10,000 steps.`);
    expect(readFileSync(join(dir, 'md.log'), 'utf8')).toMatch(/Finished mdrun/);
  } else {
    const why = `${md.stderr ?? ''}${md.stdout ?? ''}`.split('\n').filter((l) => /rdtscp|Illegal|error|signal/i.test(l)).slice(0, 3).join(' | ');
    console.log(`[${label}] gmx mdrun does not start on this machine (exit ${md.status}, signal ${md.signal ?? 'none'}${why ? `: ${why}` : ''}); relying on grompp and LAMMPS.`);
  }
}

/** Runs LAMMPS and returns each bond's exported r0 with its mean length over the run's frames (Å). */
function lammps(dir: string, label: string): { r0: number; mean: number; atoms: [number, number] }[] {
  const run = spawnSync(LMP, ['-in', 'in.run', '-log', 'log.lammps', '-screen', 'none'], { cwd: dir, encoding: 'utf8', timeout: 600_000 });
  const log = readFileSync(join(dir, 'log.lammps'), 'utf8');
  expect(run.status, log.slice(-3000)).toBe(0);
  // Thermo rows of the run (after reset_timestep): step temp pe ke etotal ebond eangle edihed eimp evdwl ecoul.
  const runPart = log.slice(log.lastIndexOf('Step'));
  const rows = runPart.split('\n').filter((l) => /^\s*\d+(\s+-?[\d.eE+-]+|\s+-?nan|\s+-?inf){10}\s*$/i.test(l)).map((l) => l.trim().split(/\s+/).map(Number));
  expect(rows.length).toBeGreaterThanOrEqual(11);
  expect(rows[rows.length - 1][0]).toBe(10000);
  for (const r of rows) for (const v of r) expect(Number.isFinite(v)).toBe(true);
  console.log(`[${label}] lmp ran ${rows[rows.length - 1][0]} steps; final temp ${rows[rows.length - 1][1].toFixed(1)} K, pe ${rows[rows.length - 1][2].toFixed(3)} kcal/mol`);
  const data = readFileSync(join(dir, readdirData(dir)), 'utf8');
  const section = (name: string) => {
    const at = data.indexOf(`\n${name}`);
    if (at < 0) return [];
    const body = data.slice(data.indexOf('\n\n', at) + 2);
    return body.slice(0, body.search(/\n\n|$/)).split('\n').filter((l) => l.trim()).map((l) => l.split('#')[0].trim().split(/\s+/).map(Number));
  };
  const r0 = new Map(section('Bond Coeffs').map((c) => [c[0], c[2]]));
  const bonds = section('Bonds').map((b) => ({ type: b[1], atoms: [b[2], b[3]] as [number, number] }));
  const frames = readFileSync(join(dir, 'traj.lammpstrj'), 'utf8').split('ITEM: TIMESTEP').slice(1);
  const sums = bonds.map(() => 0);
  for (const frame of frames) {
    const lines = frame.split('\n');
    const atomsAt = lines.findIndex((l) => l.startsWith('ITEM: ATOMS'));
    const pos = new Map<number, number[]>();
    for (const l of lines.slice(atomsAt + 1)) {
      const v = l.trim().split(/\s+/).map(Number);
      if (v.length >= 5) pos.set(v[0], v.slice(2, 5));
    }
    bonds.forEach((b, i) => {
      const [p, q] = b.atoms.map((a) => pos.get(a)!);
      sums[i] += Math.hypot(p[0] - q[0], p[1] - q[1], p[2] - q[2]);
    });
  }
  return bonds.map((b, i) => ({ atoms: b.atoms, r0: r0.get(b.type)!, mean: sums[i] / frames.length }));
}

/** The dihedral angle i–j–k–l in degrees (IUPAC sign convention), from positions. */
function dihedralDeg(i: Vec3, j: Vec3, k: Vec3, l: Vec3): number {
  const sub = (a: Vec3, b: Vec3): Vec3 => [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
  const cross = (a: Vec3, b: Vec3): Vec3 => [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];
  const dot = (a: Vec3, b: Vec3) => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
  const b1 = sub(j, i);
  const b2 = sub(k, j);
  const b3 = sub(l, k);
  const n1 = cross(b1, b2);
  const n2 = cross(b2, b3);
  const m = cross(n1, b2.map((v) => v / Math.hypot(...b2)) as Vec3);
  return (Math.atan2(dot(m, n2), dot(n1, n2)) * 180) / Math.PI;
}

const readdirData = (dir: string) => readdirSync(dir).find((n) => n.endsWith('.data') && n !== 'final.data')!;

function bondsWithin5Percent(result: ReturnType<typeof lammps>, label: string): void {
  expect(result.length).toBeGreaterThan(0);
  for (const b of result) {
    const off = Math.abs(b.mean - b.r0) / b.r0;
    console.log(`[${label}] bond ${b.atoms.join('-')}: r0 ${b.r0.toFixed(3)} A, mean ${b.mean.toFixed(3)} A (${(off * 100).toFixed(2)}% off)`);
    expect(off).toBeLessThan(0.05);
  }
}

describe('engine exports run in the engines', () => {
  it('a non-ionic surfactant (octyl diethylene glycol ether, invented mapping in four beads)', async () => {
    const f = await mappedMolecule(t.ctx.db, 'C8E2 surfactant', 'CCCCCCCCOCCOCCO', (m) => {
      const chain = chainOrder(m, 'C');
      return [
        { name: 'T1', type: 'tail', atoms: chain.slice(0, 4) },
        { name: 'T2', type: 'tail', atoms: chain.slice(4, 8) },
        { name: 'E1', type: 'ether', atoms: chain.slice(8, 11) },
        { name: 'E2', type: 'ether-OH', atoms: chain.slice(11) },
      ];
    });
    // The library gives the tail type test values of sigma and epsilon (invented); the others stay placeholders.
    const projectId = (await t.ctx.db('molecules').where({ id: f.moleculeId }).first('project_id')).project_id;
    const types = (await modeller.get(`/api/projects/${projectId}/bead-types`).expect(200)).body.types;
    await modeller.put(`/api/projects/${projectId}/bead-types`, { types: [...types, { name: 'tail', heavyAtomsPerBead: 4, charge: 0, deltaGMin: 10, deltaGMax: 30, description: 'test', sigma: 0.45, epsilon: 3 }] }).expect(200);
    const dirs = await exportBoth(f, 'surfactant');
    const top = readFileSync(join(dirs.gromacs, 'topol.top'), 'utf8');
    expect(top).toMatch(/^tail {2}0\.0 {2}0\.0 {2}A {2}0\.45 {2}3\.0$/m);
    expect(top).toMatch(/^ether {2}0\.0 {2}0\.0 {2}A {2}0\.5 {2}2\.0 {2}; PLACEHOLDER/m);
    expect(top).toContain('PLACEHOLDER non-bonded parameters for ether, ether-OH');
    grompp(dirs.gromacs, 'surfactant');
    bondsWithin5Percent(lammps(dirs.lammps, 'surfactant'), 'surfactant');
  }, 600_000);

  it('a ring-containing drug with a rigid ring (paracetamol: ring of three constrained beads, redundant terms left out)', async () => {
    const f = await mappedMolecule(t.ctx.db, 'Paracetamol', 'CC(=O)Nc1ccc(O)cc1', (m) => {
      const ring = ringOrder(m);
      const inRing = new Set(ring);
      const n = m.atoms.find((a) => a.element === 'N')!.index;
      const o = m.atoms.find((a) => a.element === 'O' && neighbours(m, a.index).some((x) => inRing.has(x)))!.index;
      // Start the pairs at the carbon that holds N, so the OH carbon (para) pairs with a neighbour.
      const start = ring.indexOf(neighbours(m, n).find((x) => inRing.has(x))!);
      const r = [...ring.slice(start), ...ring.slice(0, start)];
      const acetamide = m.atoms.filter((a) => !inRing.has(a.index) && a.index !== o).map((a) => a.index);
      const ohCarbon = neighbours(m, o).find((x) => inRing.has(x))!;
      const pairs = [r.slice(0, 2), r.slice(2, 4), r.slice(4, 6)];
      return [
        { name: 'AM', type: 'amide', atoms: acetamide },
        ...pairs.map((p, i) => ({ name: `R${i + 1}`, type: 'ring', atoms: p.includes(ohCarbon) ? [...p, o] : p })),
      ];
    });
    const ring = new Set(['R1', 'R2', 'R3']);
    const inRing = (x: BondedTerm) => x.beads.filter((b) => ring.has(b)).length;
    // Two exclusions: the amide bead sits closer to the far ring beads than the placeholder sigma.
    const dirs = await exportBoth(f, 'drug', { constrain: (x) => inRing(x) === 2, omit: (x) => inRing(x) === 3 }, 2);
    const itp = readFileSync(join(dirs.gromacs, 'paracetamol.itp'), 'utf8');
    expect(itp).toMatch(/\[ constraints \]\n;[^\n]*\n(\d+\s+\d+\s+1\s+[\d.]+\n){3}/);
    expect(itp).toContain('[ exclusions ]');
    grompp(dirs.gromacs, 'drug');
    bondsWithin5Percent(lammps(dirs.lammps, 'drug'), 'drug');
  }, 600_000);

  it('a planar ring system held planar by an improper dihedral (toluene: rigid ring of three beads, the methyl bead kept in its plane)', async () => {
    const f = await mappedMolecule(t.ctx.db, 'Toluene', 'Cc1ccccc1', (m) => {
      const ring = ringOrder(m);
      const inRing = new Set(ring);
      const methyl = m.atoms.find((a) => !inRing.has(a.index))!.index;
      const start = ring.indexOf(neighbours(m, methyl).find((x) => inRing.has(x))!);
      const r = [...ring.slice(start), ...ring.slice(0, start)];
      return [{ name: 'ME', type: 'methyl', atoms: [methyl] }, ...[r.slice(0, 2), r.slice(2, 4), r.slice(4, 6)].map((p, i) => ({ name: `R${i + 1}`, type: 'ring', atoms: p }))];
    });
    const ring = new Set(['R1', 'R2', 'R3']);
    const inRing = (x: BondedTerm) => x.beads.filter((b) => ring.has(b)).length;
    // Exclusion count 2: ME sits closer to R2 and R3 than the placeholder sigma (as for paracetamol).
    // ME and R1 lie on the same side of the R2–R3 edge: the improper ME–R2–R3–R1 is near 0° when planar.
    let xi0 = Number.NaN;
    const improper = (centre: (name: string) => Vec3): BondedTerm[] => {
      xi0 = dihedralDeg(...(['ME', 'R2', 'R3', 'R1'].map(centre) as [Vec3, Vec3, Vec3, Vec3]));
      // k: a test value (no source); the improper's own starting angle, so the model starts at rest.
      return [{ kind: 'improper', beads: ['ME', 'R2', 'R3', 'R1'], function: 'harmonic', value: Number(xi0.toFixed(2)), k: 100 }];
    };
    const dirs = await exportBoth(f, 'improper', { constrain: (x) => inRing(x) === 2, omit: (x) => inRing(x) === 3 }, 2, undefined, improper);
    expect(Math.abs(xi0)).toBeLessThan(10);
    const itp = readFileSync(join(dirs.gromacs, 'toluene.itp'), 'utf8');
    expect(itp).toMatch(/\[ dihedrals \]\n;[^\n]*\n1 {2}3 {2}4 {2}2 {2}2 {2}-?[\d.]+ {2}100\.0\n/);
    grompp(dirs.gromacs, 'improper');
    const data = readFileSync(join(dirs.lammps, readdirData(dirs.lammps)), 'utf8');
    expect(data).toMatch(/^1 impropers$/m);
    expect(data).toMatch(/Improper Coeffs # harmonic[^\n]*\n\n1 11\.950287 -?[\d.]+\n/);
    bondsWithin5Percent(lammps(dirs.lammps, 'improper'), 'improper');
    const log = readFileSync(join(dirs.lammps, 'log.lammps'), 'utf8');
    const runPart = log.slice(log.lastIndexOf('Step'));
    const eimp = runPart.split('\n').filter((l) => /^\s*\d+\s/.test(l)).map((l) => Number(l.trim().split(/\s+/)[8]));
    console.log(`[improper] eimp over the run (kcal/mol): ${eimp.map((e) => e.toFixed(4)).join(' ')}`);
    expect(eimp.every(Number.isFinite)).toBe(true);
  }, 600_000);

  it('a salt (sodium pentanoate: the carboxylate bead carries −1, the sodium ion is its own molecule type)', async () => {
    const f = await mappedMolecule(t.ctx.db, 'Sodium pentanoate', 'CCCCC(=O)[O-].[Na+]', (m) => {
      const na = m.atoms.find((a) => a.element === 'Na')!.index;
      const chain = chainOrder(m, 'C', (a) => a !== na && m.atoms[a].element === 'C');
      const os = m.atoms.filter((a) => a.element === 'O').map((a) => a.index);
      return [
        { name: 'C3', type: 'tail', atoms: chain.slice(0, 3) },
        { name: 'COO', type: 'anion', atoms: [...chain.slice(3), ...os] },
        { name: 'NA', type: 'cation', atoms: [na] },
      ];
    });
    // The residue name stored with the mapping (a setting of the draft, edited live like the rest).
    const room = (await t.collab.rooms.open(f.mappingId))!;
    await room.editDraft((next) => setResidue(next, 'SAL'), (await t.ctx.db('users').where({ email: 'modeller@example.org' }).first('id')).id);
    await room.releaseIfIdle();
    const dirs = await exportBoth(f, 'salt');
    const top = readFileSync(join(dirs.gromacs, 'topol.top'), 'utf8');
    // Moleculetype names are not cut to five characters (GROMACS reads any one-word name); .gro residue columns are.
    expect(top).toMatch(/\[ molecules \]\n; name {2}count\nSodium_pentanoate {2}1\nNA {2}1\n/);
    const itp = readFileSync(join(dirs.gromacs, 'sodium-pentanoate.itp'), 'utf8');
    expect(itp).toMatch(/^Sodium_pentanoate {2}1$/m);
    expect(itp).toMatch(/COO\s+2\s+-1\.0\s/);
    expect(itp).toMatch(/^1 {2}tail {2}1 {2}SAL {2}C3 /m);
    expect(readFileSync(join(dirs.gromacs, 'conf.gro'), 'utf8').split('\n')[2].slice(5, 10)).toBe('SAL  ');
    const stored = (await binary(modeller.get(`/api/mappings/${f.mappingId}/export?format=pdb&version=${dirs.version}`)).expect(200)).body.toString('utf8');
    expect(stored.split('\n').filter((l: string) => l.startsWith('HETATM')).map((l: string) => l.slice(17, 20))).toEqual(['SAL', 'SAL', ' NA']);
    grompp(dirs.gromacs, 'salt');
    // The PDB export: residue name as asked, the ion its own residue, blank element columns, a CRYST1 box
    // that GROMACS' own PDB reader (gmx editconf) takes over.
    const pdb = (await binary(modeller.get(`/api/mappings/${f.mappingId}/export?format=pdb&version=${dirs.version}&residue=pnt`)).expect(200)).body.toString('utf8');
    const atoms = pdb.split('\n').filter((l: string) => l.startsWith('HETATM'));
    expect(atoms.map((l: string) => `${l.slice(17, 20)} ${l.slice(22, 26).trim()}`)).toEqual(['PNT 1', 'PNT 1', ' NA 2']);
    expect(atoms.every((l: string) => l.length <= 66)).toBe(true); // columns 77–78 (element) stay blank
    const cryst = pdb.split('\n').find((l: string) => l.startsWith('CRYST1'))!;
    const edge = Number(cryst.slice(6, 15));
    expect(cryst.slice(33, 54)).toBe('  90.00  90.00  90.00');
    writeFileSync(join(dirs.gromacs, 'cg.pdb'), pdb);
    const editconf = spawnSync(GMX, ['-quiet', 'editconf', '-f', 'cg.pdb', '-o', 'from-pdb.gro'], { cwd: dirs.gromacs, encoding: 'utf8' });
    expect(editconf.status, editconf.stderr).toBe(0);
    const fromPdb = readFileSync(join(dirs.gromacs, 'from-pdb.gro'), 'utf8').trim().split('\n');
    expect(Number(fromPdb[fromPdb.length - 1].trim().split(/\s+/)[0])).toBeCloseTo(edge / 10, 3);
    expect(fromPdb[4].slice(5, 10).trim()).toBe('NA');
    await modeller.get(`/api/mappings/${f.mappingId}/export?format=csv&residue=abc`).expect(422);
    await modeller.get(`/api/mappings/${f.mappingId}/export?format=pdb&residue=toolong`).expect(400);
    bondsWithin5Percent(lammps(dirs.lammps, 'salt'), 'salt');
  }, 600_000);

  it('a 10-unit chain from a mapped repeat unit (*OCCOCC*, two beads a unit, terms across each junction)', async () => {
    const f = await mappedMolecule(t.ctx.db, 'EO2 unit', '*OCCOCC*', (m) => {
      const points = new Set(m.attachmentPoints);
      const head = neighbours(m, m.attachmentPoints![0])[0];
      const order = [head];
      for (;;) {
        const next = neighbours(m, order[order.length - 1]).filter((n) => !points.has(n) && !order.includes(n));
        if (next.length === 0) break;
        order.push(next[0]);
      }
      return [
        { name: 'A', type: 'eo', atoms: order.slice(0, 3) },
        { name: 'B', type: 'eo', atoms: order.slice(3) },
      ];
    });
    // The junction terms are listed with the next units' beads marked '+'.
    const rows: BondedTerm[] = (await modeller.get(`/api/mappings/${f.mappingId}/bonded-terms`).expect(200)).body.terms;
    await evaluated(f.mappingId);
    const listed = (await modeller.get(`/api/mappings/${f.mappingId}/bonded-terms`).expect(200)).body.terms.map((x: BondedTerm) => `${x.kind} ${x.beads.join('-')}`);
    expect(listed).toEqual(['bond A-B', 'bond A+-B', 'angle A-B-A+', 'angle B-A+-B+', 'dihedral A++-B+-A+-B', 'dihedral A-B-A+-B+']);
    expect(rows.length).toBeGreaterThan(0);
    // The chain lies along the vector from the head atom to the second attachment point.
    const xyz = JSON.parse((await t.ctx.db('molecules').where({ id: f.moleculeId }).first('xyz')).xyz) as number[][];
    const head = neighbours(f.model, f.model.attachmentPoints![0])[0];
    const a2 = f.model.attachmentPoints![1];
    const shift: Vec3 = [0, 1, 2].map((d) => xyz[a2][d] - xyz[head][d]) as Vec3;
    for (const units of [0, 201]) expect((await modeller.get(`/api/mappings/${f.mappingId}/export?format=gromacs&units=${units}`).expect(422)).body.error.code).toBe('units_out_of_range');
    // Dihedrals of a straight chain are ill-defined (angles near 180°): left out, as a modeller would.
    const dirs = await exportBoth(f, 'chain', { omit: (x) => x.kind === 'dihedral' }, 1, { units: 10, shift });
    const gro = readFileSync(join(dirs.gromacs, 'conf.gro'), 'utf8').split('\n');
    expect(Number(gro[1])).toBe(20);
    expect(gro[21].slice(0, 10)).toBe('   10EO2un');
    const itp = readFileSync(join(dirs.gromacs, 'eo2-unit.itp'), 'utf8');
    const section = (name: string) => itp.split(`[ ${name} ]`)[1]?.split('\n\n')[0].split('\n').filter((l) => /^\d/.test(l)) ?? [];
    expect(section('bonds')).toHaveLength(19); // 10 within units + 9 junctions
    expect(section('angles')).toHaveLength(18); // 9 A-B-A+ and 9 B-A+-B+
    grompp(dirs.gromacs, 'chain');
    bondsWithin5Percent(lammps(dirs.lammps, 'chain'), 'chain');
  }, 600_000);
});
