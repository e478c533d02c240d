/**
 * References and analyses checked against GROMACS (Debian's gmx 2022.5; GMX_PATH from `npm test`)
 * on invented systems (tests/helpers/reference-systems.ts): 20 copies of an invented surfactant and
 * of an invented ring-containing drug-like molecule, with thermal noise and random orientations,
 * written as .gro and turned into .xtc and .trr by `gmx trjconv`.
 *
 * - Bead centres: the mean over copies of each bead's centre equals `gmx traj -com -n` with
 *   Beadloom's .ndx in the reference's numbering (one group per bead over all copies), within XTC
 *   precision (0.001 nm). A system whose copies are not cut by the box is used here, since gmx traj
 *   does not make molecules whole.
 * - Bond and angle means and standard deviations equal values computed independently from the
 *   generator's unwrapped coordinates with the chemistry core's beadCentre, on a system whose
 *   molecules are cut by the box (so they must be made whole).
 * - DCD (written here from the same coordinates) and multi-model PDB give the XTC's result.
 * - Both systems have lone atoms after the copies (solvent-like), which the XTC reader is told not
 *   to decode (read-frames.ts): the centres still equal gmx's, and XTC still agrees with TRR.
 * - The CG trajectory download in TRR is read by `gmx check -f`.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { signedIn, type ApiClient } from '../helpers/client';
import { createMolecule, demoProjectId } from '../helpers/fixtures';
import { generateConformer } from '../../server/chem/index';
import { beadCentre } from '../../server/chem/centres';
import { prepare } from '../../server/chem/prepared';
import { createMapping } from '../../server/mappings/mappings.service';
import { dcdBytes, groText, makeSystem, pdbText, type RefSystem } from '../../seeds/invented-reference';
import type { Mapping, Molecule } from '../../src/shared/chem';
import type { AnalysisView, Term } from '../../src/shared/references';

const GMX = process.env.GMX_PATH ?? '/usr/bin/gmx';
let t: TestApp;
let modeller: ApiClient;
let dir: string;

interface Case {
  label: string;
  smiles: string;
  beads: number[][];
}

// Invented molecules. Every bead is mass-centred (gmx traj -com is a centre of mass). The ring is
// meta-substituted, so the molecule has no symmetry that could map a copy's atoms in mirror order.
const CASES: Case[] = [
  { label: 'surfactant', smiles: 'CCCCCCCCOCCOCCO', beads: [[0, 1, 2], [3, 4, 5], [6, 7, 8, 9], [10, 11, 12, 13, 14]] },
  { label: 'drug-like', smiles: 'Cc1cccc(c1)C(=O)NCCO', beads: [[0, 1], [2, 3, 4], [5, 6, 7], [8, 9, 10], [11, 12]] },
];

function gmx(args: string[], input = ''): string {
  const r = spawnSync(GMX, ['-quiet', ...args], { cwd: dir, input, encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`gmx ${args.join(' ')} failed:\n${r.stderr}`);
  return r.stdout + r.stderr;
}

async function upload(moleculeId: number, files: [string, string, Buffer | string][]): Promise<number> {
  let req = modeller.agent.post(`/api/molecules/${moleculeId}/references`).set('x-csrf-token', modeller.csrf);
  for (const [field, name, body] of files) req = req.attach(field, Buffer.isBuffer(body) ? body : Buffer.from(body), name);
  const res = await req.expect(202);
  await t.tasks.idle();
  const got = (await modeller.get(`/api/references/${res.body.id}`).expect(200)).body;
  expect(got.status, JSON.stringify(got.error)).toBe('ready');
  return res.body.id;
}

async function analyse(mappingId: number, referenceId: number): Promise<AnalysisView> {
  const res = await modeller.post(`/api/mappings/${mappingId}/analyses`, { referenceId, version: 1 }).expect(202);
  await t.tasks.idle();
  const view = (await modeller.get(`/api/analyses/${res.body.id}`).expect(200)).body as AnalysisView;
  expect(view.status, JSON.stringify(view.error)).toBe('done');
  return view;
}

beforeAll(async () => {
  t = await createTestApp();
  modeller = await signedIn(t.app, 'modeller@example.org');
  dir = mkdtempSync(join(tmpdir(), 'beadloom-gmx-'));
}, 60_000);
afterAll(async () => {
  await t.stop();
  rmSync(dir, { recursive: true, force: true });
});

describe.each(CASES)('the $label reference against GROMACS', ({ label, smiles, beads }) => {
  let mol: Molecule;
  let xyz: number[][];
  let mappingId: number;
  let moleculeId: number;
  const draft: Mapping = { beads: beads.map((atoms, i) => ({ id: `b${i}`, name: `B${i + 1}`, centre: 'mass', atoms: atoms.map((index) => ({ index, weight: 1 })) })) };

  beforeAll(async () => {
    moleculeId = await createMolecule(t.ctx.db, await demoProjectId(t.ctx.db), `Invented ${label}`, smiles);
    mol = JSON.parse((await t.ctx.db('molecules').where({ id: moleculeId }).first('model')).model) as Molecule;
    xyz = await generateConformer(mol, { seed: 21 });
    mappingId = await createMapping(t.ctx.db, moleculeId, { name: `${label} CG`, resolution: '3:1' }, null as unknown as number, draft);
    await modeller.post(`/api/mappings/${mappingId}/versions`, { message: 'for the reference' }).expect(201);
  }, 120_000);

  function convert(s: RefSystem, stem: string): void {
    writeFileSync(join(dir, `${stem}.gro`), groText(s, s.frames.slice(0, 1)));
    writeFileSync(join(dir, `${stem}-traj.gro`), groText(s));
    for (const ext of ['xtc', 'trr']) gmx(['trjconv', '-f', `${stem}-traj.gro`, '-s', `${stem}.gro`, '-o', `${stem}.${ext}`], '0\n');
  }

  it('bead centres equal gmx traj -com with Beadloom’s index file (XTC)', async () => {
    const s = makeSystem(mol, xyz, { copies: 20, frames: 6, boxA: 66, noiseA: 0.06, seed: 4, cut: false, solvent: 40 });
    const stem = `${label}-whole`;
    convert(s, stem);
    const referenceId = await upload(moleculeId, [['structure', `${stem}.gro`, readFileSync(join(dir, `${stem}.gro`))], ['trajectory', `${stem}.xtc`, readFileSync(join(dir, `${stem}.xtc`))]]);
    const view = await analyse(mappingId, referenceId);
    const ndx = await modeller.get(`/api/mappings/${mappingId}/export?format=ndx&version=1&reference=${referenceId}`).expect(200);
    expect(ndx.text).toMatch(/^; Beadloom/);
    writeFileSync(join(dir, `${stem}.ndx`), ndx.text);
    gmx(['traj', '-f', `${stem}.xtc`, '-s', `${stem}.gro`, '-n', `${stem}.ndx`, '-com', '-ng', String(beads.length), '-ox', `${stem}-com.xvg`], beads.map((_, i) => `${i}\n`).join(''));
    const rows = readFileSync(join(dir, `${stem}-com.xvg`), 'utf8').split('\n').filter((l) => l.trim() && !/^[#@]/.test(l)).map((l) => l.trim().split(/\s+/).map(Number));
    expect(rows).toHaveLength(6);
    // Our centres: the CG trajectory download (GRO, nm), averaged over the copies.
    const gro = (await modeller.get(`/api/analyses/${view.id}/cg-trajectory?format=gro`).expect(200)).text.split('\n');
    const nb = beads.length;
    for (let f = 0; f < 6; f++) {
      const atoms = gro.slice(f * (20 * nb + 3) + 2, f * (20 * nb + 3) + 2 + 20 * nb);
      for (let b = 0; b < nb; b++) {
        for (let k = 0; k < 3; k++) {
          let sum = 0;
          for (let c = 0; c < 20; c++) sum += Number(atoms[c * nb + b].slice(20 + 8 * k, 28 + 8 * k));
          expect(Math.abs(sum / 20 - rows[f][1 + 3 * b + k]), `frame ${f} bead ${b} axis ${k}`).toBeLessThan(0.002);
        }
      }
    }
  }, 120_000);

  it('bonds and angles of molecules cut by the box match the known unwrapped coordinates; XTC, TRR, DCD and PDB agree', async () => {
    const s = makeSystem(mol, xyz, { copies: 20, frames: 8, boxA: 48, noiseA: 0.06, seed: 9, solvent: 30 });
    const stem = `${label}-cut`;
    convert(s, stem);
    const structure: [string, string, string] = ['structure', `${stem}.gro`, groText(s, s.frames.slice(0, 1))];
    const results: Record<string, AnalysisView> = {};
    const trajectories: Record<string, Buffer | string> = { xtc: readFileSync(join(dir, `${stem}.xtc`)), trr: readFileSync(join(dir, `${stem}.trr`)), dcd: dcdBytes(s), pdb: pdbText(s) };
    for (const [ext, body] of Object.entries(trajectories)) results[ext] = await analyse(mappingId, await upload(moleculeId, [structure, ['trajectory', `traj.${ext}`, body]]));

    // Independent: the core's beadCentre on the generator's unwrapped coordinates.
    const p = prepare(mol);
    const centres = s.whole.map((copies) => copies.map((w) => draft.beads.map((b) => beadCentre(p, Array.from({ length: w.length / 3 }, (_, i) => [w[3 * i], w[3 * i + 1], w[3 * i + 2]]), b.atoms, b.centre)!)));
    const index = (id: string) => draft.beads.findIndex((b) => b.id === id);
    const stats = (values: number[]) => {
      const mean = values.reduce((a, v) => a + v, 0) / values.length;
      return { mean, sd: Math.sqrt(values.reduce((a, v) => a + (v - mean) ** 2, 0) / (values.length - 1)) };
    };
    const known = (term: Term, kind: 'bond' | 'angle') =>
      stats(
        centres.flatMap((copies) =>
          copies.map((x) => {
            const [i, j, k] = term.beadIds.map(index);
            const d = (a: number, b: number) => [0, 1, 2].map((q) => x[a][q] - x[b][q]);
            if (kind === 'bond') return Math.hypot(...d(i, j)) / 10;
            const u = d(i, j);
            const v = d(k, j);
            return (Math.acos((u[0] * v[0] + u[1] * v[1] + u[2] * v[2]) / (Math.hypot(...u) * Math.hypot(...v))) * 180) / Math.PI;
          }),
        ),
      );
    const xtc = results.xtc.result!;
    expect(xtc.copies).toBe(20);
    for (const term of xtc.bonds) {
      const k = known(term, 'bond');
      expect(Math.abs(term.mean - k.mean), `bond ${term.beads.join('-')} mean`).toBeLessThan(0.0005);
      expect(Math.abs(term.sd - k.sd), `bond ${term.beads.join('-')} sd`).toBeLessThan(0.0005);
    }
    for (const term of xtc.angles) {
      const k = known(term, 'angle');
      expect(Math.abs(term.mean - k.mean), `angle ${term.beads.join('-')} mean`).toBeLessThan(0.2);
      expect(Math.abs(term.sd - k.sd), `angle ${term.beads.join('-')} sd`).toBeLessThan(0.2);
    }
    for (const ext of ['trr', 'dcd', 'pdb']) {
      const other = results[ext].result!;
      other.bonds.forEach((term, i) => {
        expect(Math.abs(term.mean - xtc.bonds[i].mean), `${ext} bond ${i}`).toBeLessThan(0.001);
        expect(Math.abs(term.sd - xtc.bonds[i].sd), `${ext} bond sd ${i}`).toBeLessThan(0.001);
      });
      other.angles.forEach((term, i) => expect(Math.abs(term.mean - xtc.angles[i].mean), `${ext} angle ${i}`).toBeLessThan(0.2));
    }

    const trr = await modeller.get(`/api/analyses/${results.xtc.id}/cg-trajectory?format=trr`).buffer(true).expect(200);
    writeFileSync(join(dir, `${stem}-cg.trr`), trr.body as Buffer);
    const check = gmx(['check', '-f', `${stem}-cg.trr`]);
    expect(check).toMatch(/Coords\s+8\s/);
    expect(execFileSync(GMX, ['-quiet', 'check', '-f', `${stem}-cg.trr`], { cwd: dir, encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] })).toBeDefined();
  }, 240_000);
});

describe('broken trajectories', () => {
  it('a truncated or corrupt XTC, and a truncated DCD, fail the reference naming the frame', async () => {
    const moleculeId = await createMolecule(t.ctx.db, await demoProjectId(t.ctx.db), 'Invented broken', 'CCCCCCOCCO');
    const mol = JSON.parse((await t.ctx.db('molecules').where({ id: moleculeId }).first('model')).model) as Molecule;
    const s = makeSystem(mol, await generateConformer(mol, { seed: 2 }), { copies: 8, frames: 5, boxA: 40, noiseA: 0.05, seed: 3 });
    writeFileSync(join(dir, 'broken.gro'), groText(s, s.frames.slice(0, 1)));
    writeFileSync(join(dir, 'broken-traj.gro'), groText(s));
    gmx(['trjconv', '-f', 'broken-traj.gro', '-s', 'broken.gro', '-o', 'broken.xtc'], '0\n');
    const xtc = readFileSync(join(dir, 'broken.xtc'));
    // Frame 3 starts after two frames of 92 header bytes plus their compressed bytes (GROMACS xtcio).
    let third = 0;
    for (let f = 0; f < 2; f++) third += 92 + Math.ceil(xtc.readInt32BE(third + 88) / 4) * 4;
    expect(xtc.readInt32BE(third)).toBe(1995);
    const corrupt = Buffer.from(xtc);
    corrupt.writeInt32BE(7, third);
    const failures: [string, Buffer, RegExp][] = [
      ['broken.xtc', xtc.subarray(0, xtc.length - 40), /truncated in frame 5/],
      ['broken.dcd', dcdBytes(s).subarray(0, dcdBytes(s).length - 10), /truncated in frame 5/],
      ['broken.xtc', corrupt, /corrupt at frame 3/],
    ];
    for (const [name, body, message] of failures) {
      let req = modeller.agent.post(`/api/molecules/${moleculeId}/references`).set('x-csrf-token', modeller.csrf);
      req = req.attach('structure', readFileSync(join(dir, 'broken.gro')), 'broken.gro').attach('trajectory', body, name);
      const res = await req.expect(202);
      await t.tasks.idle();
      const got = (await modeller.get(`/api/references/${res.body.id}`).expect(200)).body;
      expect(got).toMatchObject({ status: 'failed', error: { code: 'unreadable_trajectory', message: expect.stringMatching(message) } });
    }
  }, 120_000);
});
