import { expect } from 'vitest';
import type { TestApp } from '../helpers/test-app';
import type { ApiClient } from '../helpers/client';
import { createMolecule, demoProjectId } from '../helpers/fixtures';
import { generateConformer } from '../../server/chem/index';
import { createMapping } from '../../server/mappings/mappings.service';
import { groText, makeSystem, type RefSystem } from '../../seeds/invented-reference';
import type { Mapping, Molecule } from '../../src/shared/chem';
import type { AnalysisView } from '../../src/shared/references';

// An invented surfactant (C0–C5 tail, O6 C7 C8 O9 C10 C11 O12 head) with a generated reference
// (copies in a periodic box, thermal noise) and finished analyses: what fills bonded terms and gives
// an engine export its mean structure. Bead types are invented names (placeholders in exports).

export const SURFACTANT: Mapping = {
  beads: [
    { id: 't1', name: 'T1', type: 'TAIL', centre: 'mass', atoms: [0, 1, 2].map((index) => ({ index, weight: 1 })) },
    { id: 't2', name: 'T2', type: 'TAIL', centre: 'mass', atoms: [3, 4, 5].map((index) => ({ index, weight: 1 })) },
    { id: 'e1', name: 'E1', type: 'HEAD', centre: 'geometry', atoms: [6, 7, 8].map((index) => ({ index, weight: 1 })) },
    { id: 'e2', name: 'E2', type: 'HEAD', centre: 'mass', atoms: [9, 10, 11, 12].map((index) => ({ index, weight: 1 })) },
  ],
};

export interface AnalysedSurfactant {
  moleculeId: number;
  mol: Molecule;
  sys: RefSystem;
  referenceId: number;
  /** Two mappings with the same beads; each has version 1 and a finished analysis of it. */
  mappingId: number;
  analysisId: number;
  otherMappingId: number;
  otherAnalysisId: number;
}

export async function uploadReference(t: TestApp, who: ApiClient, moleculeId: number, s: RefSystem): Promise<number> {
  const res = await who.agent
    .post(`/api/molecules/${moleculeId}/references`)
    .set('x-csrf-token', who.csrf)
    .attach('structure', Buffer.from(groText(s, s.frames.slice(0, 1))), 'box.gro')
    .attach('trajectory', Buffer.from(groText(s)), 'traj.gro')
    .expect(202);
  await t.tasks.idle();
  const got = await who.get(`/api/references/${res.body.id}`).expect(200);
  expect(got.body.status, JSON.stringify(got.body.error)).toBe('ready');
  return res.body.id;
}

export async function finishedAnalysis(t: TestApp, who: ApiClient, mappingId: number, referenceId: number, version: number | 'draft' = 1): Promise<AnalysisView> {
  const res = await who.post(`/api/mappings/${mappingId}/analyses`, { referenceId, version, temperature: 300, bins: 50 }).expect(202);
  await t.tasks.idle();
  const view: AnalysisView = (await who.get(`/api/analyses/${res.body.id}`).expect(200)).body;
  expect(view.status, JSON.stringify(view.error)).toBe('done');
  return view;
}

export async function analysedSurfactant(t: TestApp, modeller: ApiClient, name: string): Promise<AnalysedSurfactant> {
  const moleculeId = await createMolecule(t.ctx.db, await demoProjectId(t.ctx.db), name, 'CCCCCCOCCOCCO');
  const mol = JSON.parse((await t.ctx.db('molecules').where({ id: moleculeId }).first('model')).model) as Molecule;
  const sys = makeSystem(mol, await generateConformer(mol, { seed: 3 }), { copies: 8, frames: 40, boxA: 40, noiseA: 0.06, seed: 5, residue: 'SUR', solvent: 10 });
  const mappingId = await createMapping(t.ctx.db, moleculeId, { name: `${name} 3:1`, resolution: '3:1' }, null as unknown as number, SURFACTANT);
  const otherMappingId = await createMapping(t.ctx.db, moleculeId, { name: `${name} 3:1 copy`, resolution: '3:1' }, null as unknown as number, SURFACTANT);
  for (const id of [mappingId, otherMappingId]) await modeller.post(`/api/mappings/${id}/versions`, { message: 'For the reference' }).expect(201);
  const referenceId = await uploadReference(t, modeller, moleculeId, sys);
  const analysisId = (await finishedAnalysis(t, modeller, mappingId, referenceId)).id;
  const otherAnalysisId = (await finishedAnalysis(t, modeller, otherMappingId, referenceId)).id;
  return { moleculeId, mol, sys, referenceId, mappingId, analysisId, otherMappingId, otherAnalysisId };
}
