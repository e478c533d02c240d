import type { Db } from '../db/knex';
import type { Evaluation, Mapping, Resolution } from '../../src/shared/chem';
import type { VersionDetail, VersionSummary } from '../../src/shared/versions';
import type { DraftAccess } from '../mappings/draft-access';
import type { EvaluationResult } from '../drafts/evaluate-draft';
import { conflict, notFound } from '../http/errors';
import { appendAudit } from '../audit/audit.service';
import { mappingsWithMolecule } from '../mappings/mappings.service';
import { contentSha256 } from './content-hash';

// Knex for `mapping_versions`. A save reads the server's own draft (the live room's document, else
// the draft stored in MariaDB) — never anything a client sent — then numbers it inside a transaction
// that holds the mapping's row lock, so concurrent saves queue and take 1, 2, 3… in turn.

interface VersionRow {
  id: number;
  mapping_id: number;
  number: number;
  message: string;
  author_id: number | null;
  display_name: string | null;
  draft: string;
  evaluation: string | null;
  evaluation_error: string | null;
  canonical_smiles: string;
  resolution: Resolution;
  content_sha256: string;
  created_at: Date;
  production: number | null;
}

const select = (db: Db) =>
  db('mapping_versions as v')
    .leftJoin('users as u', 'u.id', 'v.author_id')
    .leftJoin('mapping_locks as l', 'l.version_id', 'v.id')
    .select('v.*', 'u.display_name', db.raw('l.mapping_id IS NOT NULL AS production'));

function toSummary(r: VersionRow): VersionSummary {
  return {
    number: r.number,
    message: r.message,
    author: r.author_id ? { id: r.author_id, displayName: r.display_name ?? '' } : null,
    createdAt: new Date(r.created_at).toISOString(),
    beadCount: (JSON.parse(r.draft) as Mapping).beads.length,
    sha256: r.content_sha256,
    production: !!r.production,
  };
}

function toDetail(r: VersionRow): VersionDetail {
  return {
    ...toSummary(r),
    mappingId: r.mapping_id,
    canonicalSmiles: r.canonical_smiles,
    resolution: r.resolution,
    draft: JSON.parse(r.draft) as Mapping,
    evaluation: r.evaluation ? (JSON.parse(r.evaluation) as Evaluation) : null,
    evaluationError: r.evaluation_error,
  };
}

export async function listVersions(db: Db, mappingId: number): Promise<VersionSummary[]> {
  const rows = await select(db).where('v.mapping_id', mappingId).orderBy('v.number', 'desc');
  return rows.map(toSummary);
}

export async function getVersion(db: Db, mappingId: number, number: number): Promise<VersionDetail & { id: number }> {
  const row = await select(db).where({ 'v.mapping_id': mappingId, 'v.number': number }).first();
  if (!row) throw notFound(`Version ${number} of this mapping`);
  return { ...toDetail(row), id: row.id };
}

export async function saveVersion(db: Db, drafts: DraftAccess, mappingId: number, authorId: number, message: string): Promise<VersionSummary> {
  const { draft, result } = await drafts.read(mappingId);
  const number = await db.transaction((trx) => insertVersion(trx, mappingId, authorId, message, draft, result));
  const saved = await select(db).where({ 'v.mapping_id': mappingId, 'v.number': number }).first();
  return toSummary(saved);
}

/**
 * Numbers and stores `draft` as the mapping's next version inside the caller's transaction (which
 * this makes hold the mapping's row lock, so concurrent saves queue and take 1, 2, 3… in turn).
 */
export async function insertVersion(trx: Db, mappingId: number, authorId: number, message: string, draft: Mapping, result: EvaluationResult): Promise<number> {
  const mapping = await mappingsWithMolecule(trx)
    .where('p.id', mappingId)
    .forUpdate()
    .first('p.resolution', 'm.canonical_smiles');
  if (!mapping) throw notFound('That mapping');
  const last = await trx('mapping_versions').where({ mapping_id: mappingId }).max({ n: 'number' }).first();
  const next = Number(last?.n ?? 0) + 1;
  await trx('mapping_versions').insert({
    mapping_id: mappingId,
    number: next,
    message,
    author_id: authorId,
    draft: JSON.stringify(draft),
    evaluation: result.evaluation ? JSON.stringify(result.evaluation) : null,
    evaluation_error: result.error?.message ?? null,
    canonical_smiles: mapping.canonical_smiles,
    resolution: result.evaluation?.resolution ?? mapping.resolution,
    content_sha256: contentSha256(mapping.canonical_smiles, draft),
  }).catch((err: { code?: string }) => {
    // The row lock makes this unreachable in practice; the unique key is the last word.
    if (err.code === 'ER_DUP_ENTRY') throw conflict('version_conflict', 'Another save took that version number; save again.');
    throw err;
  });
  await appendAudit(trx, { mappingId, action: 'save', actorId: authorId, version: next, reason: message });
  return next;
}

/** The newest version's content hash (null when there is none), read inside the caller's transaction. */
export async function latestVersionHash(trx: Db, mappingId: number): Promise<string | null> {
  const row = await trx('mapping_versions').where({ mapping_id: mappingId }).orderBy('number', 'desc').first('content_sha256');
  return row?.content_sha256 ?? null;
}
