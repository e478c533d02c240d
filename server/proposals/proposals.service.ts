import type { Db } from '../db/knex';
import type { Mapping, Resolution } from '../../src/shared/chem';
import type { Proposal, ProposalBody, TransferResult } from '../../src/shared/proposals';
import { libraryFor } from '../bead-types/bead-types.service';
import { loadEvaluationInputs } from '../drafts/drafts.service';
import { notFound, unprocessable } from '../http/errors';
import type { DraftAccess } from '../mappings/draft-access';
import type { MappingStarts } from '../mappings/mapping-starts';
import { parseModel } from '../molecules/molecule-view';
import { getVersion } from '../versions/versions.service';
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

export function mappingStarts(db: Db, drafts: DraftAccess): MappingStarts {
  return {
    async proposal(moleculeId: number, resolution: Resolution): Promise<Mapping> {
      const { model, library } = await moleculeOf(db, moleculeId);
      const [best] = await proposeInThread({ kind: 'propose', model, resolution, scope: 'all', draft: { beads: [] }, library });
      return { beads: (best?.beads ?? []).map((b, i) => ({ id: `p${i + 1}`, name: b.name, ...(b.type ? { type: b.type } : {}), centre: 'mass', atoms: b.atoms.map((index) => ({ index, weight: 1 })) })) };
    },

    async transfer(moleculeId, from, resolution): Promise<TransferResult> {
      const target = await moleculeOf(db, moleculeId);
      const source = await db('mappings as p').join('molecules as m', 'm.id', 'p.molecule_id').where('p.id', from.transferFrom).first('m.id', 'm.project_id', 'm.model');
      if (!source || source.project_id !== target.projectId) {
        throw unprocessable('transfer_source_invalid', `Mapping ${from.transferFrom} is not a mapping of a molecule of this project.`, { transferFrom: from.transferFrom });
      }
      let sourceMapping: Mapping;
      if (from.version !== undefined) {
        const version = await getVersion(db, from.transferFrom, from.version).catch(() => null);
        if (!version) throw unprocessable('transfer_version_invalid', `Mapping ${from.transferFrom} has no version ${from.version}.`, { transferFrom: from.transferFrom, version: from.version });
        sourceMapping = version.draft;
      } else sourceMapping = (await drafts.read(from.transferFrom)).draft;
      return transferInThread({ kind: 'transfer', source: parseModel(source), sourceMapping, target: target.model, resolution, library: target.library });
    },
  };
}
