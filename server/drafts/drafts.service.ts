import * as Y from 'yjs';
import type { Db } from '../db/knex';
import { applyChecked, hasPending } from '../../src/shared/mapping-doc-check';
import { docToMapping } from '../../src/shared/mapping-doc';
import type { Mapping } from '../../src/shared/chem';
import { parseModel } from '../molecules/molecule-view';
import { libraryFor } from '../bead-types/bead-types.service';
import type { StoredDraft } from './draft-storage';
import type { EvaluationInputs, EvaluationResult } from './evaluate-draft';
import { evaluateOnceInThread } from './evaluation-thread';

// The snapshot writer lives with the mappings (a new mapping's first snapshot is written there, and
// this module builds on mappings, not the other way round); re-exported for the storage seam.
export { foldSnapshot, writeSnapshot } from '../mappings/draft-snapshots.service';

// The drafts' queries. Storage of mapping drafts in MariaDB: an append-only table of accepted Yjs updates
// (mapping_updates, written by update-log.ts) and one compacted snapshot per mapping (mapping_snapshots).
// The draft is the snapshot with every later update applied, in id order. Loading makes the live
// room's document checks again (same checks, same order): a row that fails them — not a Yjs update at
// all, or one that would be refused live (content out of bounds, dependencies never received) — is
// skipped instead of making the whole draft unloadable, and the next compaction drops it. A snapshot
// written before pending structs were refused may hold some: they are dropped at load (they were
// never part of anyone's visible draft).
// Compaction writes the merged state and deletes the updates it contains, in one transaction, so a
// crash at any point loses nothing.

/**
 * The stored draft. `atomCount` (the molecule's atoms) is needed for the checks; without it, it is read
 * from the molecule.
 */
export async function loadDraft(db: Db, mappingId: number, atomCount?: number): Promise<StoredDraft> {
  // One consistent read (REPEATABLE READ: both SELECTs see the same moment). Read one after the other,
  // a compaction committing in between would have folded and deleted updates the old snapshot lacks.
  const { snap, rows } = await db.transaction(
    async (trx) => {
      const snap = await trx('mapping_snapshots').where({ mapping_id: mappingId }).first('state', 'last_update_id');
      const after = snap ? Number(snap.last_update_id) : 0;
      const rows: { id: number; data: Uint8Array }[] = await trx('mapping_updates').where('mapping_id', mappingId).andWhere('id', '>', after).orderBy('id').select('id', 'data');
      return { snap, rows };
    },
    { isolationLevel: 'repeatable read' },
  );
  let lastUpdateId = snap ? Number(snap.last_update_id) : 0;
  if (rows.length) lastUpdateId = Number(rows[rows.length - 1].id);
  const atoms = atomCount ?? (rows.length ? await atomCountOf(db, mappingId) : 0);
  const base: Uint8Array[] = snap ? [snap.state] : [];
  let doc = docOf(base);
  const kept: Uint8Array[] = [];
  if (hasPending(doc)) {
    const visible = Y.encodeStateAsUpdate(withoutPending(doc));
    doc.destroy();
    base.splice(0, 1, visible);
    doc = docOf(base);
  }
  for (const r of rows) {
    let accepted: boolean;
    try {
      accepted = applyChecked(doc, r.data, atoms) === null;
    } catch {
      accepted = false; // not a Yjs update at all
    }
    if (accepted) kept.push(r.data);
    else {
      doc.destroy();
      doc = docOf([...base, ...kept]);
    }
  }
  return { doc, lastUpdateId, pending: rows.length };
}

/** The document without its pending structs and deletions (encodeStateAsUpdate would include them). */
function withoutPending(doc: Y.Doc): Y.Doc {
  doc.store.pendingStructs = null;
  doc.store.pendingDs = null;
  return doc;
}

function docOf(updates: Uint8Array[]): Y.Doc {
  const doc = new Y.Doc({ gc: true });
  if (updates.length) Y.applyUpdate(doc, Y.mergeUpdates(updates));
  return doc;
}

/** How many atoms the mapping's molecule has (from its stored model, without sending the model here). */
async function atomCountOf(db: Db, mappingId: number): Promise<number> {
  const row = await db('mappings as p').join('molecules as m', 'm.id', 'p.molecule_id').where('p.id', mappingId).first(db.raw("JSON_LENGTH(m.model, '$.atoms') as n"));
  return Number(row?.n ?? 0);
}

/** Keeps the mapping row's bead count and "updated" time current for lists. */
export async function touchMapping(db: Db, id: number, beadCount: number): Promise<void> {
  await db('mappings').where({ id }).update({ bead_count: beadCount, updated_at: db.fn.now() });
}

/** What the chemistry core needs to evaluate one mapping's draft (the evaluation itself is in the evaluation thread). */
export async function loadEvaluationInputs(db: Db, mappingId: number): Promise<EvaluationInputs | null> {
  const row = await db('mappings as p')
    .join('molecules as m', 'm.id', 'p.molecule_id')
    .where('p.id', mappingId)
    .first('p.id', 'p.resolution', 'p.locked', 'm.id as molecule_id', 'm.project_id', 'm.model', 'm.xyz');
  if (!row) return null;
  const library = await libraryFor(db, row.project_id);
  return {
    mappingId,
    moleculeId: row.molecule_id,
    projectId: row.project_id,
    locked: !!row.locked,
    resolution: row.resolution,
    model: parseModel({ id: row.molecule_id, model: row.model }),
    xyz: row.xyz ? (JSON.parse(row.xyz) as number[][]) : null,
    library: library.length ? library : undefined,
  };
}

/**
 * One short string that changes whenever anything a stored draft's evaluation depends on changes:
 * the draft (the newest stored update — update ids only grow — and the snapshot's length and CRC-32,
 * which change when compaction folds updates in or anything writes the draft anew), the mapping's resolution and lock, the molecule's coordinates (length and CRC-32: they
 * are replaced whole when a conformer arrives or is uploaded), and the project's library (only ever
 * replaced whole, with new row ids: its row count and highest id). The molecule's model is not in it:
 * it is fixed when the molecule is created (a model backfill only fills missing ones, at start-up).
 * One indexed round trip, against loading and evaluating the draft. Null when there is no such mapping.
 */
export async function draftStamp(db: Db, mappingId: number): Promise<string | null> {
  const [rows] = await db.raw(
    `SELECT CONCAT_WS('|', p.resolution, p.locked, p.molecule_id, m.project_id, COALESCE(LENGTH(m.xyz), -1), COALESCE(CRC32(m.xyz), 0),
       COALESCE((SELECT MAX(u.id) FROM mapping_updates u WHERE u.mapping_id = p.id), 0),
       COALESCE((SELECT CONCAT_WS(':', s.last_update_id, LENGTH(s.state), CRC32(s.state)) FROM mapping_snapshots s WHERE s.mapping_id = p.id), 0),
       (SELECT CONCAT(COUNT(*), ':', COALESCE(MAX(b.id), 0)) FROM bead_types b WHERE b.project_id = m.project_id)) AS stamp
     FROM mappings p JOIN molecules m ON m.id = p.molecule_id WHERE p.id = ?`,
    [mappingId],
  );
  return (rows as { stamp: string }[])[0]?.stamp ?? null;
}

/** A stored draft and its evaluation, read while no room holds the mapping; null when there is no such mapping. */
export async function readStoredDraft(db: Db, mappingId: number): Promise<{ draft: Mapping; result: EvaluationResult } | null> {
  const inputs = await loadEvaluationInputs(db, mappingId);
  if (!inputs) return null;
  const draft = docToMapping((await loadDraft(db, mappingId, inputs.model.atoms.length)).doc);
  return { draft, result: await evaluateOnceInThread(inputs, draft) };
}
