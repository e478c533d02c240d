import type { Db } from '../db/knex';
import type { Mapping, Resolution } from '../../src/shared/chem';
import { proposedAtoms, type Proposal, type ProposalBody, type TransferResult } from '../../src/shared/proposals';
import { libraryFor } from '../bead-types/bead-types.service';
import { loadEvaluationInputs } from '../drafts/drafts.service';
import { notFound, unprocessable } from '../http/errors';
import type { DraftAccess } from '../mappings/draft-access';
import type { MappingStarts } from '../mappings/mapping-starts';
import { parseModel } from '../molecules/molecule-view';
import { getVersion } from '../versions/versions.service';
import { lockState } from '../lock/lock.service';
import type { SourceVersion } from '../../src/shared/mappings';
import { proposeInThread, transferInThread } from './proposal-thread';

// Proposals (nothing written) and the two proposal-based ways a new mapping starts. The chemistry
// runs in the proposal thread; here the stored model, draft and library are gathered.

export async function proposeFor(db: Db, drafts: DraftAccess, mappingId: number, body: ProposalBody): Promise<Proposal[]> {
  const inputs = await loadEvaluationInputs(db, mappingId);
  if (!inputs) throw notFound('That mapping');
  const { draft } = await drafts.read(mappingId);
  return proposeInThread({ kind: 'propose', model: inputs.model, resolution: body.resolution ?? inputs.resolution, scope: body.scope, draft, library: inputs.library });
}

async function moleculeOf(db: Db, moleculeId: number) {
  const row = await db('molecules').where({ id: moleculeId }).first('id', 'project_id', 'model');
  if (!row) throw notFound('That molecule');
  const library = await libraryFor(db, row.project_id);
  return { projectId: row.project_id as number, model: parseModel(row), library: library.length ? library : undefined };
}

/**
 * One state of a source mapping: its draft (no version, or 'draft'), its locked production version, or a
 * saved version. A state it does not have is a 422 with `code` (the copy's or the transfer's).
 */
async function sourceState(db: Db, drafts: DraftAccess, mappingId: number, version: SourceVersion | undefined, code: string, field: string) {
  if (version === undefined || version === 'draft') return { draft: (await drafts.read(mappingId)).draft, version: null, production: false };
  const lock = await lockState(db, mappingId);
  const number = version === 'production' ? lock.version : version;
  const found = number === null ? null : await getVersion(db, mappingId, number).catch(() => null);
  if (!found) {
    const what = version === 'production' ? 'no locked production version' : `no version ${version}`;
    throw unprocessable(code, `Mapping ${mappingId} has ${what}.`, { [field]: mappingId, version });
  }
  return { draft: found.draft, version: found.number, production: lock.locked && lock.version === found.number };
}

export function mappingStarts(db: Db, drafts: DraftAccess): MappingStarts {
  return {
    async proposal(moleculeId: number, resolution: Resolution): Promise<Mapping> {
      const { model, library } = await moleculeOf(db, moleculeId);
      const [best] = await proposeInThread({ kind: 'propose', model, resolution, scope: 'all', draft: { beads: [] }, library });
      return { beads: (best?.beads ?? []).map((b, i) => ({ id: `p${i + 1}`, name: b.name, ...(b.type ? { type: b.type } : {}), centre: 'mass', atoms: proposedAtoms(b) })) };
    },

    async transfer(moleculeId, from, resolution): Promise<TransferResult> {
      const target = await moleculeOf(db, moleculeId);
      const source = await db('mappings as p')
        .join('molecules as m', 'm.id', 'p.molecule_id')
        .where('p.id', from.transferFrom)
        .first('m.id', 'm.project_id', 'm.model', 'm.name as molecule_name', 'p.name as mapping_name');
      if (!source || source.project_id !== target.projectId) {
        throw unprocessable('transfer_source_invalid', `Mapping ${from.transferFrom} is not a mapping of a molecule of this project.`, { transferFrom: from.transferFrom });
      }
      const state = await sourceState(db, drafts, from.transferFrom, from.version, 'transfer_version_invalid', 'transferFrom');
      const result = await transferInThread({ kind: 'transfer', source: parseModel(source), sourceMapping: state.draft, target: target.model, resolution, library: target.library });
      const about = { mappingId: from.transferFrom, mappingName: source.mapping_name as string, moleculeName: source.molecule_name as string, version: state.version, production: state.production };
      return { draft: result.draft, report: { ...result.report, source: about } };
    },

    async copy(moleculeId, from): Promise<Mapping> {
      const row = await db('mappings').where({ id: from.copyOf, molecule_id: moleculeId }).first('id');
      if (!row) throw unprocessable('copy_source_invalid', `Mapping ${from.copyOf} is not a mapping of this molecule.`, { copyOf: from.copyOf });
      return (await sourceState(db, drafts, from.copyOf, from.version, 'copy_version_invalid', 'copyOf')).draft;
    },
  };
}
