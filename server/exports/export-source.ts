import type { Db } from '../db/knex';
import type { Evaluation, Mapping, Molecule, Resolution } from '../../src/shared/chem';
import type { VersionRef } from '../../src/shared/versions';
import type { DraftAccess } from '../mappings/draft-access';
import { conflict, notFound } from '../http/errors';
import { parseModel } from '../molecules/molecule-view';
import { getVersion } from '../versions/versions.service';
import { lockState } from '../lock/lock.service';
import { contentSha256 } from '../versions/content-hash';
import { mappingForExport } from './exports.service';

// Everything an export file is written from: one state of a mapping (the draft, a version, or the
// locked production version) with its evaluation, the molecule and the content's SHA-256.

export interface ExportSource {
  mappingId: number;
  mappingName: string;
  moleculeName: string;
  resolution: Resolution;
  /** Version number, or null for the draft. */
  version: number | null;
  production: boolean;
  canonicalSmiles: string;
  draft: Mapping;
  evaluation: Evaluation | null;
  model: Molecule;
  /** The molecule's 3D coordinates (Å, atom-index contract order), null when it has none yet. */
  xyz: number[][] | null;
  sha256: string;
}

/** "v2", "draft": how file names and headers name the state. */
export const stateLabel = (s: Pick<ExportSource, 'version'>) => (s.version === null ? 'draft' : `v${s.version}`);

export async function exportSource(db: Db, drafts: DraftAccess, mappingId: number, ref: VersionRef): Promise<ExportSource> {
  const row = await mappingForExport(db, mappingId);
  if (!row) throw notFound('That mapping');
  const base = { mappingId, mappingName: row.name as string, moleculeName: row.molecule_name as string, model: parseModel({ id: row.molecule_id, model: row.model }), xyz: row.xyz ? (JSON.parse(row.xyz) as number[][]) : null };
  const lock = await lockState(db, mappingId);
  let number: number;
  if (ref === 'draft') {
    const { draft, result } = await drafts.read(mappingId);
    const smiles = row.canonical_smiles as string;
    return { ...base, resolution: row.resolution, version: null, production: false, canonicalSmiles: smiles, draft, evaluation: result.evaluation, sha256: contentSha256(smiles, draft) };
  } else if (ref === 'production') {
    if (!lock.locked || lock.version === null) throw conflict('no_production_version', 'This mapping has no locked production version to export.');
    number = lock.version;
  } else number = ref;
  const v = await getVersion(db, mappingId, number);
  return { ...base, resolution: v.resolution, version: v.number, production: lock.version === v.number, canonicalSmiles: v.canonicalSmiles, draft: v.draft, evaluation: v.evaluation, sha256: v.sha256 };
}
