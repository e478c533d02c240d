import { mkdir, readFile, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { Knex } from 'knex';
import { evaluateMapping, generateConformer } from '../server/chem/index';
import type { Mapping, Molecule } from '../src/shared/chem';
import { createMapping } from '../server/mappings/mappings.service';
import { docToMapping } from '../src/shared/mapping-doc';
import { loadDraft } from '../server/drafts/drafts.service';
import { matchReference } from '../server/references/match-reference';
import { referenceDir, analysisDir } from '../server/references/reference-files';
import { planAnalysis } from '../server/analyses/analysis-plan';
import { runAnalysis } from '../server/analyses/analysis-run';
import { contentSha256 } from '../server/versions/content-hash';
import { DEFAULT_BINS, DEFAULT_TEMPERATURE } from '../src/shared/references';
import { groText, makeSystem } from './invented-reference';

// The demo's reference: an invented box of 27 C12E4 copies (thermal noise around one seeded
// conformer, random orientations, some cut by the box; nothing simulated), matched and analysed with
// the C12E4 mapping's draft by the same code the app runs, so `npm start` shows distributions at once.
// Invented data, for the demo only.

const FRAMES = 40;

export async function seedDemoReference(db: Knex, dataDir: string): Promise<void> {
  const mapping = await db('mappings as p').join('molecules as m', 'm.id', 'p.molecule_id').where('p.name', 'C12E4 at 4:1').first('p.id', 'p.molecule_id', 'm.project_id', 'm.model', 'm.canonical_smiles');
  if (!mapping) return;
  const model = JSON.parse(mapping.model) as Molecule;
  const modeller = (await db('users').where({ email: 'modeller@example.org' }).first('id'))?.id ?? null;
  // The demo's C12E4 mapping leaves the last ethoxy units open on purpose (its checks show it); the
  // analysis uses a complete copy of it with two more beads.
  const open = docToMapping((await loadDraft(db, mapping.id, model.atoms.length)).doc);
  const draft: Mapping = {
    beads: [
      ...open.beads,
      { id: 'demo-c12-e3', name: 'E3', centre: 'mass', atoms: [18, 19, 20].map((index) => ({ index, weight: 1 })) },
      { id: 'demo-c12-e4', name: 'E4', centre: 'mass', atoms: [21, 22, 23, 24].map((index) => ({ index, weight: 1 })) },
    ],
  };
  const mappingId = await createMapping(db, mapping.molecule_id, { name: 'C12E4 at 4:1, every atom', resolution: '4:1', description: 'The demo mapping completed, applied to the invented demo reference.' }, modeller, draft);
  const system = makeSystem(model, await generateConformer(model, { seed: 42 }), { copies: 27, frames: FRAMES, boxA: 105, noiseA: 0.06, seed: 2026, residue: 'C12E4', solvent: 40 });
  const structure = groText(system, system.frames.slice(0, 1));
  const trajectory = groText(system);
  const [referenceId] = await db('simulation_references').insert({
    molecule_id: mapping.molecule_id,
    project_id: mapping.project_id,
    name: 'Invented C12E4 box (demo)',
    status: 'matching',
    structure_name: 'c12e4-box.gro',
    structure_format: 'gro',
    trajectory_name: 'c12e4-box-traj.gro',
    trajectory_format: 'gro',
    bytes: structure.length + trajectory.length,
    created_by: modeller,
  });
  const dir = referenceDir(dataDir, referenceId);
  await mkdir(dir, { recursive: true });
  await writeFile(join(dir, 'structure.gro'), structure);
  await writeFile(join(dir, 'trajectory.gro'), trajectory);
  const found = await matchReference({ structure: { path: join(dir, 'structure.gro'), format: 'gro' }, trajectory: { path: join(dir, 'trajectory.gro'), format: 'gro' }, selection: null, molecule: model, outDir: dir }, () => {});
  await db('simulation_references').where({ id: referenceId }).update({ status: 'ready', progress_done: 1000, progress_total: 1000, copies: found.copies, frames: found.frames, atoms_per_copy: found.atomsPerCopy, atoms_total: found.atomsTotal, source_format: 'gro' });

  const plan = planAnalysis(model, draft, evaluateMapping(model, draft, { fragments: false }));
  const [analysisId] = await db('analyses').insert({
    mapping_id: mappingId,
    reference_id: referenceId,
    version_ref: 'draft',
    version_number: null,
    content_sha256: contentSha256(mapping.canonical_smiles, draft),
    temperature: DEFAULT_TEMPERATURE,
    bins: DEFAULT_BINS,
    status: 'running',
    mapping_state: JSON.stringify(plan),
    created_by: modeller,
  });
  const index = JSON.parse(await readFile(join(dir, 'frames.json'), 'utf8'));
  const out = analysisDir(dataDir, analysisId);
  await mkdir(out, { recursive: true });
  const result = await runAnalysis({ plan, source: found.source, index, copiesFile: join(dir, 'copies.bin'), copies: found.copies, atomsPerCopy: found.atomsPerCopy, outDir: out, temperature: DEFAULT_TEMPERATURE, bins: DEFAULT_BINS });
  await db('analyses').where({ id: analysisId }).update({ status: 'done', progress_done: found.frames, progress_total: found.frames, result: JSON.stringify(result), started_at: db.fn.now(3), finished_at: db.fn.now(3) });
}
